/**
 * Who may do what: one row for every page, form action and endpoint in the route tree (the
 * matrix test fails when a route has no row here, or a row names a route that is gone).
 *
 * Outcomes: `ok` 200 · `signin` redirect to the sign-in page · `redirect` redirect elsewhere ·
 * `forbidden` 403 · `unauthorised` 401 · `notfound` 404 · `allowed` — not refused: any answer
 * under 500 other than 401, 403 or the sign-in redirect (an empty form may fairly get a 400).
 * A 500 never matches anything.
 */
export type Outcome =
	'ok' | 'signin' | 'redirect' | 'forbidden' | 'unauthorised' | 'notfound' | 'allowed';
export type RoleName = 'anonymous' | 'customer' | 'helper' | 'owner';
export const ROLE_NAMES: RoleName[] = ['anonymous', 'customer', 'helper', 'owner'];

/** Values looked up in the seeded demo database before the matrix runs. */
export type Fixtures = { lineId: number; photoKey: string; closedFairId: number; pieceId: number };

/** Actions on a piece go to an id no piece has, so a matrix run never retires or edits one. */
const NO_PIECE = 999999;

export type Expectation = Record<RoleName, Outcome> & {
	/** The concrete address to call; defaults to the route itself. */
	url?: string | ((f: Fixtures) => string);
};

const every = (o: Outcome) => ({ anonymous: o, customer: o, helper: o, owner: o });
/** Owner and helper; a customer is refused; nobody signed in is sent to sign in. */
const staff = { anonymous: 'signin', customer: 'forbidden', helper: 'ok', owner: 'ok' } as const;
const ownerOnly = { ...staff, helper: 'forbidden' } as const;
const staffAction = { ...staff, helper: 'allowed', owner: 'allowed' } as const;
const ownerAction = { ...staffAction, helper: 'forbidden' } as const;
const staffApi = {
	anonymous: 'unauthorised',
	customer: 'forbidden',
	helper: 'ok',
	owner: 'ok'
} as const;
/** A write through the API with an empty body: refused for outsiders, a 4xx message for staff. */
const staffApiWrite = { ...staffApi, helper: 'allowed', owner: 'allowed' } as const;
const ownerApiWrite = { ...staffApiWrite, helper: 'forbidden' } as const;
/** Pages for signing in: shown to visitors, signed-in people are sent on. */
const guestPage = {
	anonymous: 'ok',
	customer: 'redirect',
	helper: 'redirect',
	owner: 'redirect'
} as const;

/** A page of a fair that has closed, so no matrix call can change an open one. */
const FAIR = (sub: string) => (f: Fixtures) => `/workshop/fairs/${f.closedFairId}${sub}`;

export const EXPECTATIONS: Record<string, Expectation> = {
	// Public shop.
	'GET /': every('ok'),
	'GET /shop': every('ok'),
	'GET /shop/[slug]': { ...every('ok'), url: '/shop/rosette-bottle-holder' },
	'POST /shop/[slug]?/add': { ...every('allowed'), url: '/shop/rosette-bottle-holder?/add' },
	'GET /care': every('ok'),
	// The old buyer-notes address, kept working: a permanent redirect to /care.
	'GET /safety': every('redirect'),
	'GET /contact': every('ok'),
	// What the phone shows for a page that needs signal.
	'GET /offline': every('ok'),
	'GET /policies': every('ok'),
	'GET /fairs': every('ok'),
	'GET /photos/[...key]': { ...every('ok'), url: (f) => `/photos/${f.photoKey}/400.webp` },
	'GET /cart': every('ok'),
	'POST /cart?/quantity': every('allowed'),
	'POST /cart?/remove': every('allowed'),
	'POST /cart?/destination': every('allowed'),
	'GET /checkout': every('allowed'),
	'POST /checkout': every('allowed'),
	'GET /checkout/done': every('allowed'),
	// Juniper's own order: only her account (or the signed link) opens it; same 404 for others.
	'GET /orders/[ref]': {
		anonymous: 'notfound',
		customer: 'ok',
		helper: 'notfound',
		owner: 'notfound',
		url: '/orders/CS-1001'
	},
	// Writing to the shop about an order: the same key or account as the page (an empty form: 400).
	'POST /orders/[ref]?/message': {
		anonymous: 'notfound',
		customer: 'allowed',
		helper: 'notfound',
		owner: 'notfound',
		url: '/orders/CS-1001?/message'
	},
	'GET /robots.txt': every('ok'),
	'GET /sitemap.xml': every('ok'),
	'GET /account': { anonymous: 'signin', customer: 'ok', helper: 'ok', owner: 'ok' },

	// Signing in and out.
	'GET /signin': guestPage,
	'POST /signin': every('allowed'),
	'GET /signup': guestPage,
	'POST /signup': every('allowed'),
	'GET /reset': every('ok'),
	'POST /reset': every('allowed'),
	'GET /reset/[token]': { ...every('ok'), url: '/reset/not-a-real-token' },
	'POST /reset/[token]': { ...every('allowed'), url: '/reset/not-a-real-token' },
	'GET /signup/[token]': { ...every('ok'), url: '/signup/not-a-real-token' },
	'POST /signup/[token]': { ...every('allowed'), url: '/signup/not-a-real-token' },
	'GET /signout': every('allowed'),
	'POST /signout': every('allowed'),

	// JSON API.
	'GET /api/cart': every('ok'),
	'GET /api/me': every('ok'),
	'POST /api/cart': every('allowed'),
	'PATCH /api/cart': every('allowed'),
	'DELETE /api/cart': every('allowed'),
	'GET /api/pattern': {
		...every('ok'),
		url: '/api/pattern?diameter=70&count=3&width=100&length=300&initials=HM&wood=cherry'
	},
	'POST /api/payments/webhook': every('allowed'),
	'GET /api/workshop/orders': staffApi,
	'POST /api/workshop/orders/[ref]/shipments': {
		...staffApiWrite,
		url: '/api/workshop/orders/CS-1001/shipments'
	},
	'POST /api/uploads': ownerApiWrite,
	// Booth writes go to a closed fair: staff get its plain refusal, nothing is stored.
	'POST /api/booth/[fairId]/sales': {
		...staffApiWrite,
		url: (f) => `/api/booth/${f.closedFairId}/sales`
	},
	'POST /api/booth/[fairId]/orders': {
		...staffApiWrite,
		url: (f) => `/api/booth/${f.closedFairId}/orders`
	},
	'POST /api/booth/[fairId]/tally': {
		...staffApiWrite,
		url: (f) => `/api/booth/${f.closedFairId}/tally`
	},
	'POST /api/booth/[fairId]/voids': {
		...staffApiWrite,
		url: (f) => `/api/booth/${f.closedFairId}/voids`
	},
	'POST /api/booth/[fairId]/discards': {
		...staffApiWrite,
		url: (f) => `/api/booth/${f.closedFairId}/discards`
	},

	// Workshop.
	'GET /workshop': staff,
	'POST /workshop?/retryMail': ownerAction,
	'GET /workshop/safety': staff,
	'GET /workshop/orders': staff,
	'GET /workshop/orders/[ref]': { ...staff, url: '/workshop/orders/CS-1001' },
	'POST /workshop/orders?/move': staffAction,
	// An empty form to each order action: staff get a message, refunds and restock are the owner's.
	'POST /workshop/orders/[ref]?/move': { ...staffAction, url: '/workshop/orders/CS-1001?/move' },
	'POST /workshop/orders/[ref]?/ship': { ...staffAction, url: '/workshop/orders/CS-1001?/ship' },
	'POST /workshop/orders/[ref]?/note': { ...staffAction, url: '/workshop/orders/CS-1001?/note' },
	'POST /workshop/orders/[ref]?/refund': {
		...ownerAction,
		url: '/workshop/orders/CS-1001?/refund'
	},
	'POST /workshop/orders/[ref]?/balance': {
		...ownerAction,
		url: '/workshop/orders/CS-1001?/balance'
	},
	'POST /workshop/orders/[ref]?/returned': {
		...ownerAction,
		url: '/workshop/orders/CS-1001?/returned'
	},
	// Cancel and a step back are the owner's; an empty form (no reason) changes nothing.
	'POST /workshop/orders/[ref]?/cancel': {
		...ownerAction,
		url: '/workshop/orders/CS-1001?/cancel'
	},
	'POST /workshop/orders/[ref]?/back': { ...ownerAction, url: '/workshop/orders/CS-1001?/back' },
	'GET /workshop/orders/orders.csv': staff,
	'GET /workshop/queue': staff,
	'POST /workshop/queue?/hours': ownerAction,
	'POST /workshop/queue?/alerts': staffAction,
	'GET /workshop/orders/[ref]/lines/[lineId]/template.pdf': {
		...staff,
		url: (f) => `/workshop/orders/CS-1001/lines/${f.lineId}/template.pdf`
	},
	'GET /workshop/orders/[ref]/packing-slip.pdf': {
		...staff,
		url: '/workshop/orders/CS-1001/packing-slip.pdf'
	},
	'GET /workshop/orders/[ref]/gift-slip.pdf': {
		...staff,
		url: '/workshop/orders/CS-1001/gift-slip.pdf'
	},
	'GET /workshop/orders/packing-slips.pdf': {
		...staff,
		url: '/workshop/orders/packing-slips.pdf?refs=CS-1001,CS-1002'
	},
	'GET /workshop/pieces': ownerOnly,
	'GET /workshop/pieces/new': ownerOnly,
	'POST /workshop/pieces/new': ownerAction,
	'GET /workshop/pieces/[id]': { ...ownerOnly, url: (f) => `/workshop/pieces/${f.pieceId}` },
	...Object.fromEntries(
		['alt', 'deletePhoto', 'move', 'restore', 'retire', 'save', 'stock'].map((a) => [
			`POST /workshop/pieces/[id]?/${a}`,
			{ ...ownerAction, url: `/workshop/pieces/${NO_PIECE}?/${a}` }
		])
	),
	// Fairs: staff sell and count; the owner alone creates, edits, closes and sees the money.
	'GET /workshop/fairs': staff,
	'GET /workshop/booth': staff,
	'POST /workshop/fairs?/create': ownerAction,
	'GET /workshop/fairs/[id]': { ...staff, url: FAIR('') },
	'POST /workshop/fairs/[id]?/save': { ...ownerAction, url: FAIR('?/save') },
	'POST /workshop/fairs/[id]?/helpers': { ...ownerAction, url: FAIR('?/helpers') },
	'POST /workshop/fairs/[id]?/loadOut': { ...staffAction, url: FAIR('?/loadOut') },
	'GET /workshop/fairs/[id]/booth': { ...staff, url: FAIR('/booth') },
	'GET /workshop/fairs/[id]/checklist.pdf': { ...staff, url: FAIR('/checklist.pdf') },
	'GET /workshop/fairs/[id]/tally': { ...staff, url: FAIR('/tally') },
	'POST /workshop/fairs/[id]/tally?/counts': { ...staffAction, url: FAIR('/tally?/counts') },
	'POST /workshop/fairs/[id]/tally?/close': { ...ownerAction, url: FAIR('/tally?/close') },
	'GET /workshop/fairs/[id]/report': { ...ownerOnly, url: FAIR('/report') },
	'GET /workshop/fairs/[id]/report.csv': { ...ownerOnly, url: FAIR('/report.csv') },
	'GET /workshop/reports': ownerOnly,
	'GET /workshop/reports/money.csv': ownerOnly,
	'GET /workshop/layout': ownerOnly,
	'GET /workshop/layout/template.pdf': ownerAction,
	'GET /workshop/people': ownerOnly,
	'POST /workshop/people?/add': ownerAction,
	'POST /workshop/people?/promote': ownerAction,
	'POST /workshop/people?/remove': ownerAction,
	'GET /workshop/settings': ownerOnly,
	'POST /workshop/settings?/tax': ownerAction,
	'POST /workshop/settings?/shop': ownerAction,
	'POST /workshop/settings?/away': ownerAction,
	'POST /workshop/settings?/rates': ownerAction,
	'POST /workshop/settings?/policies': ownerAction,
	'POST /workshop/settings?/format': ownerAction,
	'POST /workshop/settings?/words': ownerAction
};
