/**
 * The demo's wood prices; the woods themselves (Wood Handbook values) are the engine's list in
 * src/lib/catalogue/woods.ts, the one source for wood facts.
 */

/** Price add-on per wood over the base price (USD cents): harder woods take longer to carve. */
export const WOOD_ADD_ON: Record<string, number> = {
	basswood: 0,
	butternut: 400,
	cherry: 800,
	walnut: 1200,
	maple: 1000
};
