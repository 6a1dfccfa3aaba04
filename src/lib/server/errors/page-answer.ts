import { error } from '@sveltejs/kit';
import { DomainError } from './domain-error';

/**
 * The one adapter from a DomainError to a page load's answer: the error page with its status and
 * sentence (`error(status, message)`). Anything else is a fault and is thrown on.
 */
export async function orPageError<T>(run: () => Promise<T>): Promise<T> {
	try {
		return await run();
	} catch (err) {
		if (err instanceof DomainError) error(err.status, err.message);
		throw err;
	}
}
