import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { DomainError } from '../errors/domain-error';

const NO_FAIR = 'There is no such fair.';
const idSchema = z.coerce.number().int().positive();

/** The fair id from a JSON route's address; a DomainError 404 when it cannot be one. */
export function fairIdOf(raw: string): number {
	const id = idSchema.safeParse(raw);
	if (!id.success) throw new DomainError(404, NO_FAIR);
	return id.data;
}

/** The fair id from a page's address, or the plain 404 page. */
export function fairIdParam(raw: string): number {
	const id = idSchema.safeParse(raw);
	if (!id.success) error(404, NO_FAIR);
	return id.data;
}
