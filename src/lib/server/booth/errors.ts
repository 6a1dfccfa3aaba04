/** A refusal the person can act on; routes turn it into a 4xx with this message. */
export class FairError extends Error {
	constructor(
		message: string,
		readonly status: 400 | 403 | 404 | 409 | 413 = 400
	) {
		super(message);
	}
}
