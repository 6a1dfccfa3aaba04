import { comingFairs } from '$lib/server/fairs/fairs';
import type { PageServerLoad } from './$types';

/** Public: where to find the booth. Names, places and dates only. */
export const load: PageServerLoad = async () => ({ fairs: await comingFairs() });
