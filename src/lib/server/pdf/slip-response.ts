import { json } from '@sveltejs/kit';
import type { z } from 'zod';
import { config } from '../config';
import { slipsPdf, type SlipKind, type SlipPaper } from './packing-slip';
import { slipOrders, slipShop } from './slip-data';
import { orderRef, slipQuery } from '$lib/orders/slips-schema';

/** Reads the query with a schema; `{ error }` with 400 when it does not fit. */
export function parseQuery<S extends z.ZodType>(url: URL, schema: S) {
	const parsed = schema.safeParse(Object.fromEntries(url.searchParams));
	if (parsed.success) return { data: parsed.data };
	const fields: Record<string, string[]> = {};
	for (const i of parsed.error.issues) (fields[String(i.path[0])] ??= []).push(i.message);
	return { response: json({ error: parsed.error.issues[0].message, fields }, { status: 400 }) };
}

/** One order's slip, from the route's `[ref]` and `?paper=`. */
export function oneOrderSlip(url: URL, ref: string, kind: SlipKind) {
	const q = parseQuery(url, slipQuery.omit({ kind: true }));
	if (q.response) return q.response;
	const parsed = orderRef.safeParse(ref);
	if (!parsed.success) return json({ error: 'No such order.' }, { status: 404 });
	return slipResponse([parsed.data], q.data.paper, kind);
}

/** The slips for these orders as a PDF download; 404 naming any reference not found. */
export async function slipResponse(refs: string[], paper: SlipPaper, kind: SlipKind) {
	const { found, missing } = await slipOrders(refs);
	if (missing.length) return json({ error: `No order ${missing.join(', ')}.` }, { status: 404 });
	const bytes = await slipsPdf(await slipShop(), found, { paper, kind, origin: config.origin });
	const name = `${kind}-slip${refs.length > 1 ? 's' : ''}-${refs.length > 1 ? `${refs.length}-orders` : refs[0]}-${paper}.pdf`;
	return new Response(bytes as BodyInit, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `inline; filename="${name}"`,
			'cache-control': 'private, no-store'
		}
	});
}
