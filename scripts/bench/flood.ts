/**
 * The shop's p99 while /api/pattern is flooded, against its unloaded p99 (target: within 3×).
 * A heavy but valid layout from 200 connections while 10 others load the home page; load from
 * autocannon (npm). Prints, does not fail.
 */
import autocannon from 'autocannon';

/** A heavy layout that is still within the pattern API's bound. */
const HEAVY = '/api/pattern?diameter=150&count=6&width=1000&length=2000&spacing=50&initials=HMW';
const seconds = Number(process.env.BENCH_FLOOD_S || 10);

const load = (url: string, connections: number) =>
	autocannon({ url, connections, duration: seconds, timeout: 10 });

export type FloodFigure = {
	shopP99Ms: number | null;
	unloadedP99Ms: number | null;
	ratio: number | null;
	note: string;
};

export async function shopP99UnderPatternFlood(baseUrl: string): Promise<FloodFigure> {
	await load(`${baseUrl}/`, 4); // warm up
	const unloaded = await load(`${baseUrl}/`, 10);
	const [flood, loaded] = await Promise.all([
		load(`${baseUrl}${HEAVY}`, 200),
		load(`${baseUrl}/`, 10)
	]);
	const ratio = loaded.latency.p99 / Math.max(1, unloaded.latency.p99);
	const codes = Object.entries(flood.statusCodeStats ?? {})
		.map(([c, s]) => `${c}×${s.count}`)
		.join(' ');
	return {
		shopP99Ms: loaded.latency.p99,
		unloadedP99Ms: unloaded.latency.p99,
		ratio,
		note:
			`unloaded ${unloaded.latency.p99} ms; ${ratio.toFixed(2)}× unloaded (target ≤ 3×: ${ratio <= 3 ? 'met' : 'MISSED'}); ` +
			`flood answers ${codes}, timeouts ${flood.timeouts}; shop errors ${loaded.errors}, non-2xx ${loaded.non2xx}`
	};
}
