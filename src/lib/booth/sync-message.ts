/**
 * What the booth's phone sends and what the server answers, typed once: the phone builds its
 * outbox entries from these types (`z.input`), the server checks what arrives with the same
 * schemas and works on what they give (`z.output`), and the phone reads the answer by the same
 * type the server writes.
 */
import { z } from 'zod';
import { emailAddress } from '$lib/forms/email';
import { requiredText } from '$lib/forms/required-text';

/** The sales route's limits: at most this many sales, and this many bytes, in one request. */
export const BOOTH_MAX_SALES = 1000;
export const BOOTH_MAX_BYTES = 2_000_000;
/** How many the booth screen sends at once: well under the limits above. */
export const BOOTH_CHUNK = 50;
/** The booth screen also keeps each batch's body under this, leaving room below the 2 MB cap. */
export const BOOTH_CHUNK_BYTES = 1_500_000;
/** At most this many of one piece on one line, and this many pieces in one sale. */
export const MAX_LINE_QUANTITY = 100;
export const MAX_SALE_PIECES = 200;

const slug = z.string().trim().min(1).max(80);
/** Ids made on the phone: UUIDs, or any 8–36 letters, digits and dashes. */
export const clientId = z
	.string()
	.regex(/^[A-Za-z0-9-]{8,36}$/, 'A sale id is 8 to 36 letters, digits or dashes.');

export const boothSaleSchema = z.object({
	id: clientId,
	at: z.iso.datetime({ offset: true, error: 'The sale time must be an ISO date and time.' }),
	lines: z
		.array(
			z.object({
				pieceSlug: slug,
				woodSlug: slug,
				quantity: z
					.number({ error: 'A quantity is a whole number from 1 to 100.' })
					.int('A quantity is a whole number from 1 to 100.')
					.min(1, 'A quantity is a whole number from 1 to 100.')
					.max(MAX_LINE_QUANTITY, 'A quantity is a whole number from 1 to 100.')
			})
		)
		.min(1, 'A sale needs at least one piece.')
		.max(50, 'A sale holds at most 50 lines.')
		.refine(
			(ls) => ls.reduce((a, l) => a + l.quantity, 0) <= MAX_SALE_PIECES,
			`One sale holds at most ${MAX_SALE_PIECES} pieces; split it into several sales.`
		)
		.refine(
			(ls) => new Set(ls.map((l) => `${l.pieceSlug}/${l.woodSlug}`)).size === ls.length,
			'The same piece is on two lines; put it on one line with its count.'
		),
	discountMinor: z
		.number()
		.int('The discount must be whole cents.')
		.min(0, 'The discount cannot be negative.')
		.default(0),
	method: z.enum(['cash', 'card', 'other'], { error: 'Pay by cash, card or other.' }),
	tenderedMinor: z.number().int().min(0).max(100_000_000).nullable().optional(),
	/** A split payment: this much of a cash sale went on the card. */
	cardPartMinor: z
		.number()
		.int('The card part must be whole cents.')
		.min(1, 'The card part must be more than nothing.')
		.max(100_000_000)
		.nullable()
		.optional(),
	receiptEmail: z
		.string()
		.trim()
		.toLowerCase()
		.max(255, 'That e-mail address is too long.')
		.pipe(
			z.union([z.literal(''), z.email('The receipt address does not look like an e-mail address.')])
		)
		.optional()
});
/** A sale as the phone sends it. */
export type SalePayload = z.input<typeof boothSaleSchema>;
/** A sale as the server takes it, checked. */
export type BoothSale = z.output<typeof boothSaleSchema>;

/** The batch shell only: entries are checked one by one so a broken one spares the rest. */
export const boothBatchSchema = z.object({
	sales: z.array(z.unknown(), { error: 'Send { sales: [...] }.' })
});

/** The server's answer to a batch of sales, id by id. */
export const syncAnswerSchema = z.object({
	accepted: z.array(z.string()),
	duplicate: z.array(z.string()),
	/** Accepted, but made before the close and received after it. */
	late: z.array(z.string()),
	rejected: z.array(
		z.object({ id: z.string().nullable(), error: z.string(), conflict: z.boolean().optional() })
	)
});
export type SyncAnswer = z.infer<typeof syncAnswerSchema>;

export const boothOrderSchema = z
	.object({
		id: clientId,
		at: z.iso.datetime({ offset: true }),
		pieceSlug: slug,
		woodSlug: slug,
		initials: z
			.string()
			.trim()
			.min(1, 'Enter the initials to carve.')
			.max(3, 'At most three initials.')
			.regex(/^[A-Za-z&]+$/, 'Initials are letters (and &).'),
		name: requiredText('the buyer’s name', 120),
		email: emailAddress,
		line1: z.string().trim().max(120, 'Keep the street address under 120 characters.').default(''),
		city: z.string().trim().max(80, 'Keep the town under 80 characters.').default(''),
		region: z.string().trim().max(80).optional(),
		postcode: z.string().trim().max(12, 'Keep the postcode under 12 characters.').default(''),
		country: z.string().trim().toUpperCase().length(2, 'Country as two letters, like US.'),
		depositMinor: z.number().int().min(0, 'The deposit cannot be negative.').max(100_000_000),
		method: z.enum(['cash', 'card', 'other']),
		delivery: z.enum(['post', 'collect']).default('post')
	})
	.superRefine((o, ctx) => {
		if (o.delivery !== 'post') return;
		for (const [k, label] of [
			['line1', 'the street address'],
			['city', 'the town'],
			['postcode', 'the postcode']
		] as const)
			if (!o[k]) ctx.addIssue({ code: 'custom', path: [k], message: `Enter ${label} to post it.` });
	});
export type OrderPayload = z.input<typeof boothOrderSchema>;
export type BoothOrder = z.output<typeof boothOrderSchema>;

/** A void (or refund) of a booth sale, made on the phone and queued like a sale. */
export const boothVoidSchema = z.object({
	id: clientId,
	saleId: clientId,
	at: z.iso.datetime({ offset: true, error: 'The void time must be an ISO date and time.' }),
	reason: requiredText('the reason for the void', 300)
});
export type VoidPayload = z.input<typeof boothVoidSchema>;
export type BoothVoid = z.output<typeof boothVoidSchema>;

/** A refused entry the helper threw away on the phone; the owner still sees it. */
export const boothDiscardSchema = z.object({
	id: clientId,
	kind: z.enum(['sale', 'deposit']),
	summary: z.string().trim().min(1).max(500),
	reason: z.string().trim().min(1).max(500)
});
export type DiscardPayload = z.input<typeof boothDiscardSchema>;
