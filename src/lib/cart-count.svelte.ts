import { getContext, setContext } from 'svelte';

/**
 * The header's basket count, shared by the shop layout and any page that changes the cart.
 * Lives in context (one per page tree), never in a module variable shared across requests.
 */
export class CartCount {
	value = $state(0);
	constructor(initial: number) {
		this.value = initial;
	}
	set(n: number) {
		this.value = n;
	}
}

const KEY = Symbol('cart-count');

export const provideCartCount = (initial: number) => setContext(KEY, new CartCount(initial));

/** Pages outside the shop layout get a detached counter, so callers never need a null check. */
export const useCartCount = (): CartCount => getContext<CartCount>(KEY) ?? new CartCount(0);
