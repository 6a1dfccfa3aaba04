import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';
import { comingFairs } from '$lib/server/fairs/fairs';
import type { PageServerLoad } from './$types';

/**
 * The home page's rosette with the seller's initials, drawn by the same engine as every buyer's
 * preview — on the server, so the engine and its letter outlines stay out of the page's script —
 * and the next fair for the line under the welcome.
 */
export const load: PageServerLoad = async () => {
	const [next] = await comingFairs();
	return {
		nextFair: next ?? null,
		rosette: computePattern(
			{
				diameterMm: 100,
				count: 1,
				initials: 'HM',
				woodSlug: 'basswood',
				widthMm: 112,
				lengthMm: 112,
				marginMm: 4
			},
			{ font: letterFont(), idPrefix: 'home', padMm: 0 }
		).svg
	};
};
