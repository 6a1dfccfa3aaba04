import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { FairError } from './errors';

/** The fair id from the URL, or a plain 404. */
export function fairIdParam(raw: string): number {
	const id = z.coerce.number().int().positive().safeParse(raw);
	if (!id.success) error(404, 'There is no such fair.');
	return id.data;
}

/** Runs a domain call from a page: a FairError becomes a 4xx page, anything else is a bug. */
export async function orPageError<T>(run: () => Promise<T>): Promise<T> {
	try {
		return await run();
	} catch (err) {
		if (err instanceof FairError) error(err.status, err.message);
		throw err;
	}
}

/** The same for form actions: a FairError becomes `fail(status, { message })` beside the form. */
export async function orFail<T>(run: () => Promise<T>) {
	try {
		return await run();
	} catch (err) {
		if (err instanceof FairError) return fail(err.status, { message: err.message });
		throw err;
	}
}
