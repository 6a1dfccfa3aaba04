/** Used when no origin is given (unit tests, or code with no request at hand). */
const PLACEHOLDER_ORIGIN = 'http://chipstall.invalid';

/**
 * Where to go after signing in: a path on this site, or `fallback`.
 *
 * The decision is made by the WHATWG URL parser, the same one browsers use to follow a
 * `Location`, not by looking at the string: `next` is resolved against the app's own origin and
 * kept only when it stays on that origin. The path we answer with is then resolved a second time,
 * because a same-origin URL whose path starts with `//` (from "/.//evil", "/a/..//evil",
 * "/%2e//evil") would be read by the browser as a link to another host.
 */
export function safeNext(
	next: string | null | undefined,
	fallback = '/',
	origin = PLACEHOLDER_ORIGIN
): string {
	if (!next || !next.startsWith('/')) return fallback;
	// Tabs and newlines are silently removed by the parser, so "/\t/evil" would become "//evil".
	// eslint-disable-next-line no-control-regex -- matching control characters is the point here
	if (/[\u0000-\u001f\u007f]/.test(next)) return fallback;
	const own = new URL(origin).origin;
	const resolved = parse(next, own);
	if (!resolved || resolved.origin !== own) return fallback;
	const path = resolved.pathname + resolved.search + resolved.hash;
	if (!path.startsWith('/') || path.startsWith('//') || path.startsWith('/\\')) return fallback;
	const again = parse(path, own);
	if (!again || again.origin !== own || again.href !== resolved.href) return fallback;
	return path;
}

function parse(input: string, base: string): URL | null {
	try {
		return new URL(input, base);
	} catch {
		return null;
	}
}

/** Where someone lands after signing in when no `next` was asked for. */
export function homeFor(role: 'owner' | 'helper' | 'customer'): string {
	return role === 'customer' ? '/account' : '/workshop';
}
