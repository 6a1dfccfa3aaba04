import { requireRole } from '$lib/server/auth/guard';
import { plannerSchema } from '$lib/pattern/pattern-schema';
import { WOODS } from '$lib/catalogue/woods';
import type { PageServerLoad } from './$types';

/** Planner defaults: a bottle holder blank with three 70 mm rosettes; the URL may override them. */
const DEFAULTS: Record<string, string> = {
	width: '100',
	length: '300',
	thickness: '26',
	curvedTop: '1',
	margin: '5',
	diameter: '70',
	count: '3',
	spacing: '35',
	split: '0',
	firstCentre: '',
	initials: '',
	wood: 'basswood',
	border: '0',
	edge: '26',
	offsets: '5, 2, 1.5',
	step: '5',
	start: '5',
	triangles: '2'
};

export const load: PageServerLoad = (event) => {
	requireRole(event, 'owner');
	const values = { ...DEFAULTS };
	for (const key of Object.keys(DEFAULTS)) {
		const v = event.url.searchParams.get(key);
		if (v !== null) values[key] = v;
	}
	// A bad bookmark falls back to the defaults instead of failing.
	if (!plannerSchema.safeParse(values).success) Object.assign(values, DEFAULTS);
	return {
		values,
		woods: WOODS.map((w) => ({ slug: w.slug, name: w.name }))
	};
};
