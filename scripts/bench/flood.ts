/**
 * SLOT for the hardening work: "shop p99 while /api/pattern is flooded".
 *
 * The throttling change ships its own measurement of this figure. When it is merged, replace
 * the body of `shopP99UnderPatternFlood` with it (same signature): flood `/api/pattern` from
 * one load generator while another measures `/shop`, and return the shop's p99 in ms. Until
 * then it reports `null` with a note, and bench.ts prints that.
 */
export type FloodFigure = { shopP99Ms: number | null; note: string };

export function shopP99UnderPatternFlood(_baseUrl: string): Promise<FloodFigure> {
	return Promise.resolve({
		shopP99Ms: null,
		note: 'measured by the throttling change (not on this branch)'
	});
}
