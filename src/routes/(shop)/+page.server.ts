import { comingFairs } from '$lib/server/fairs/fairs';
import type { PageServerLoad } from './$types';

/** The next fair for the line under the welcome. */
export const load: PageServerLoad = async () => {
	const [next] = await comingFairs();
	return { nextFair: next ?? null };
};
