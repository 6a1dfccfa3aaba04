import type { FieldErrors } from '$lib/forms/parse-form';

/**
 * The one error type of the domain: a refusal a person can act on. It carries the HTTP status to
 * answer with (4xx, or 503 when a service we need is down), a plain sentence, and optionally the
 * fields it concerns. Routes never map it by hand: form actions answer it through `orFail`
 * (`$lib/server/errors/form-answer`), page loads through `orPageError`
 * (`$lib/server/errors/page-answer`), JSON routes through `orApiError`
 * (`$lib/server/http/api-errors`). Anything else thrown is a fault (500).
 */

export type DomainStatus = 400 | 403 | 404 | 409 | 413 | 429 | 503;

/**
 * What a caller may need to tell refusals apart by (the message is for people, not for code):
 * `empty`, `stock`, `price`, `rates`, `payment` say why a checkout stopped; `short` is stock that
 * would go below zero; `signature` is a webhook whose signature was refused; `photo` is a file
 * refused as a photo (the upload names the file before the message).
 */
export type DomainCode =
	'empty' | 'stock' | 'price' | 'rates' | 'payment' | 'short' | 'signature' | 'photo';

export type DomainErrorOptions = {
	code?: DomainCode;
	/** Messages by field name, shown beside the inputs (forms) or as `fields` (JSON). */
	fields?: FieldErrors;
	/** A figure a caller may reword the message with (e.g. how many are on hand). */
	count?: number;
};

export class DomainError extends Error {
	readonly status: DomainStatus;
	readonly code?: DomainCode;
	readonly fields?: FieldErrors;
	readonly count?: number;

	constructor(status: DomainStatus, message: string, options: DomainErrorOptions = {}) {
		super(message);
		this.name = 'DomainError';
		this.status = status;
		this.code = options.code;
		this.fields = options.fields;
		this.count = options.count;
	}
}

/** True for a DomainError (optionally of one code). */
export function isDomainError(err: unknown, code?: DomainCode): err is DomainError {
	return err instanceof DomainError && (code === undefined || err.code === code);
}
