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
export type Fixtures = { lineId: number; photoKey: string };

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
/** Pages for signing in: shown to visitors, signed-in people are sent on. */
const guestPage = {
	anonymous: 'ok',
	customer: 'redirect',
	helper: 'redirect',
	owner: 'redirect'
} as const;

export const EXPECTATIONS: Record<string, Expectation> = {
	// Public shop.
	'GET /': every('ok'),
	'GET /shop': every('ok'),
	'GET /shop/[slug]': { ...every('ok'), url: '/shop/rosette-bottle-holder' },
	'POST /shop/[slug]?/add': { ...every('allowed'), url: '/shop/rosette-bottle-holder?/add' },
	'GET /safety': every('ok'),
	'GET /photos/[...key]': { ...every('ok'), url: (f) => `/photos/${f.photoKey}/640.webp` },
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
	'GET /signout': every('allowed'),
	'POST /signout': every('allowed'),

	// JSON API.
	'GET /api/cart': every('ok'),
	'POST /api/cart': every('allowed'),
	'PATCH /api/cart': every('allowed'),
	'DELETE /api/cart': every('allowed'),
	'GET /api/pattern': {
		...every('ok'),
		url: '/api/pattern?diameter=70&count=3&width=100&length=300&initials=HM&wood=cherry'
	},
	'POST /api/payments/webhook': every('allowed'),
	'GET /api/workshop/orders': staffApi,

	// Workshop.
	'GET /workshop': staff,
	'GET /workshop/orders': staff,
	'GET /workshop/orders/[ref]': { ...staff, url: '/workshop/orders/CS-1001' },
	'GET /workshop/orders/[ref]/lines/[lineId]/template.pdf': {
		...staff,
		url: (f) => `/workshop/orders/CS-1001/lines/${f.lineId}/template.pdf`
	},
	'GET /workshop/layout': ownerOnly,
	'GET /workshop/layout/template.pdf': ownerAction,
	'GET /workshop/people': ownerOnly,
	'POST /workshop/people?/add': ownerAction,
	'POST /workshop/people?/promote': ownerAction,
	'POST /workshop/people?/remove': ownerAction,
	'GET /workshop/settings': ownerOnly,
	'POST /workshop/settings?/tax': ownerAction
};
