/** The part of autocannon's programmatic API the bench uses (the package ships no types). */
declare module 'autocannon' {
	type Histogram = { average: number; p50: number; p99: number };
	type Result = { requests: Histogram; latency: Histogram; errors: number; non2xx: number };
	type Options = {
		url: string;
		connections?: number;
		duration?: number;
		headers?: Record<string, string>;
	};
	export default function autocannon(opts: Options): Promise<Result>;
}
