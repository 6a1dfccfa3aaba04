import { z } from 'zod';
import { orderStatuses, type OrderStatus } from '$lib/orders/status';

/** The columns the workshop's order table sorts by, as the URL and the API name them. */
export const orderSortKeys = [
	'ref',
	'createdAt',
	'buyerName',
	'status',
	'readyBy',
	'totalMinor',
	'personalised'
] as const;
export type OrderSortKey = (typeof orderSortKeys)[number];
export const pageSizes = [10, 25, 50, 100] as const;

/**
 * Which orders the table starts from. `action`: the ones the workshop has to do something about
 * (paid through packed, and paid orders whose piece sold meanwhile). `closed`: shipped, refunded,
 * or cancelled after a payment. `abandoned`: checkouts never paid (waiting, or cancelled unpaid),
 * shown only when asked for. `all`: action and closed, still without abandoned checkouts.
 */
export const orderViews = ['action', 'closed', 'abandoned', 'all'] as const;
export type OrderView = (typeof orderViews)[number];
export const orderViewLabels: Record<OrderView, string> = {
	action: 'Needs doing',
	closed: 'Shipped and closed',
	abandoned: 'Unpaid checkouts',
	all: 'All paid orders'
};
/** The statuses each view can hold, for the status boxes the page offers under it. */
export const viewStatuses: Record<OrderView, readonly OrderStatus[]> = {
	action: ['paid', 'carving', 'finishing', 'packed', 'piece_gone'],
	closed: ['shipped', 'refunded', 'cancelled'],
	abandoned: ['pending', 'cancelled'],
	all: ['paid', 'carving', 'finishing', 'packed', 'piece_gone', 'shipped', 'refunded', 'cancelled']
};

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-07.');

/**
 * The whole table state, as it stands in the page's URL and the API's query string: sort,
 * filters, search and page. Empty values mean "no filter".
 */
export const orderTableQuery = z
	.object({
		view: z.enum(orderViews, { error: 'Unknown view.' }).default('action'),
		sort: z.enum(orderSortKeys).default('createdAt'),
		dir: z.enum(['asc', 'desc']).default('desc'),
		status: z
			.string()
			.default('')
			.transform((s) => (s ? s.split(',') : []))
			.pipe(z.array(z.enum(orderStatuses, { error: 'Unknown status.' })).max(orderStatuses.length)),
		from: isoDate.or(z.literal('')).default(''),
		to: isoDate.or(z.literal('')).default(''),
		personalised: z.enum(['any', 'yes', 'no']).default('any'),
		q: z.string().trim().max(100, 'Search for at most 100 characters.').default(''),
		page: z.coerce.number().int().min(1).max(100_000).default(1),
		size: z.coerce
			.number()
			.int()
			.refine((n) => (pageSizes as readonly number[]).includes(n), 'Show 10, 25, 50 or 100.')
			.default(25)
	})
	.refine((v) => !v.from || !v.to || v.from <= v.to, {
		path: ['to'],
		message: 'The end date comes before the start date.'
	});
export type OrderTableQuery = z.output<typeof orderTableQuery>;

type Params = Record<string, string | undefined>;

const fromParams = (p: URLSearchParams): Params =>
	Object.fromEntries([...p.entries()].filter(([, v]) => v !== ''));

/** Strict: for the API, where a bad query is a 400 with the field named. */
export function parseOrderTableQuery(p: URLSearchParams) {
	return orderTableQuery.safeParse(fromParams(p));
}

/** Lenient: for the page, where a bad bookmark falls back field by field to the defaults. */
export function tableStateFromUrl(p: URLSearchParams): OrderTableQuery {
	const raw = fromParams(p);
	for (let i = 0; i < 12; i++) {
		const r = orderTableQuery.safeParse(raw);
		if (r.success) return r.data;
		for (const issue of r.error.issues) delete raw[String(issue.path[0])];
		if (r.error.issues.every((x) => x.path.length === 0)) break;
	}
	return orderTableQuery.parse({});
}

const DEFAULTS: OrderTableQuery = orderTableQuery.parse({});

/** The state as a query string, leaving out what is at its default so links stay short. */
export function tableStateToParams(s: OrderTableQuery): URLSearchParams {
	const out = new URLSearchParams();
	const put = (k: keyof OrderTableQuery, v: string) => {
		const d = DEFAULTS[k];
		if (v !== (Array.isArray(d) ? d.join(',') : String(d))) out.set(k, v);
	};
	put('view', s.view);
	put('sort', s.sort);
	put('dir', s.dir);
	put('status', s.status.join(','));
	put('from', s.from);
	put('to', s.to);
	put('personalised', s.personalised);
	put('q', s.q);
	put('page', String(s.page));
	put('size', String(s.size));
	return out;
}

/** One row of the table as the API sends it. */
export type WorkshopOrderRow = {
	ref: string;
	buyerName: string;
	email: string;
	status: OrderStatus;
	createdAt: string;
	readyBy: string | null;
	totalMinor: number;
	refundedMinor: number;
	currency: string;
	city: string;
	personalised: number;
	toCarve: number;
	pieces: number;
};
