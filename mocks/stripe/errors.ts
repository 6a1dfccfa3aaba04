/** A Stripe-shaped API error: `{ error: { type, code, message, param } }` with its HTTP status. */
export class ApiError extends Error {
	constructor(
		public status: number,
		public type: 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error',
		message: string,
		public code?: string,
		public param?: string
	) {
		super(message);
	}

	body() {
		return {
			error: {
				type: this.type,
				code: this.code,
				message: this.message,
				param: this.param
			}
		};
	}
}

export const missing = (param: string) =>
	new ApiError(
		400,
		'invalid_request_error',
		`Missing required param: ${param}.`,
		'parameter_missing',
		param
	);

export const invalid = (param: string, message: string, code = 'parameter_invalid') =>
	new ApiError(400, 'invalid_request_error', message, code, param);

export const noSuch = (kind: string, id: string, param?: string) =>
	new ApiError(
		param ? 400 : 404,
		'invalid_request_error',
		`No such ${kind}: '${id}'`,
		'resource_missing',
		param
	);
