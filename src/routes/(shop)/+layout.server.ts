import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals }) => {
	// The basket count is filled in by the cart module once it exists.
	return { user: locals.user, cartCount: 0 };
};
