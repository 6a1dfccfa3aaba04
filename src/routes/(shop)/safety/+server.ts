import { redirect } from '@sveltejs/kit';
import type { RequestHandler } from './$types';

/** The buyer's notes moved to /care (the carver's own safety notes are in the workshop). */
export const GET: RequestHandler = () => redirect(308, '/care');
