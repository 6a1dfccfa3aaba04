import { getContext, setContext } from 'svelte';

/**
 * The header's visitor fragment — basket count and signed-in name — shared by the shop layout and
 * any page that changes the cart. Public pages are rendered the same for everyone (so the page
 * cache can serve them to anyone), and this is filled in the browser from GET /api/me.
 * Lives in context (one per page tree), never in a module variable shared across requests.
 */
export class CartCount {
	value = $state(0);
	/** The signed-in name, or null for a visitor who is not signed in (or not yet known). */
	name = $state<string | null>(null);
	/** Signed in with a workshop account (owner or helper). */
	staff = $state(false);
	/** Whether /api/me has answered once on this page. */
	known = $state(false);
	#asked = 0;
	constructor(initial: number) {
		this.value = initial;
	}
	set(n: number) {
		this.value = n;
	}
	/** Asks the server who this visitor is; only the latest answer counts. */
	async refresh(fetcher: typeof fetch = fetch) {
		const ask = ++this.#asked;
		try {
			const res = await fetcher('/api/me', { headers: { accept: 'application/json' } });
			if (!res.ok) return;
			const me = (await res.json()) as { basketCount: number; name: string | null; staff: boolean };
			if (ask !== this.#asked) return;
			this.value = me.basketCount;
			this.name = me.name;
			this.staff = me.staff;
			this.known = true;
		} catch {
			// No signal: the header keeps what it showed; the next navigation asks again.
		}
	}
}

const KEY = Symbol('cart-count');

export const provideCartCount = (initial: number) => setContext(KEY, new CartCount(initial));

/** Pages outside the shop layout get a detached counter, so callers never need a null check. */
export const useCartCount = (): CartCount => getContext<CartCount>(KEY) ?? new CartCount(0);
