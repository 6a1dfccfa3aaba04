/**
 * Where to go after signing in. Only a path on this site is accepted: anything that would
 * leave it ("//other.example", "https://…", "/\\other", "javascript:") falls back.
 */
export function safeNext(next: string | null | undefined, fallback = '/'): string {
	if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) {
		return fallback;
	}
	// Control characters can turn into "//" once a browser strips them.
	// eslint-disable-next-line no-control-regex -- matching control characters is the point here
	if (/[\u0000-\u001f\u007f]/.test(next)) return fallback;
	const base = 'http://chipstall.invalid';
	let url: URL;
	try {
		url = new URL(next, base);
	} catch {
		return fallback;
	}
	if (url.origin !== base) return fallback;
	return url.pathname + url.search + url.hash;
}

/** Where someone lands after signing in when no `next` was asked for. */
export function homeFor(role: 'owner' | 'helper' | 'customer'): string {
	return role === 'customer' ? '/account' : '/workshop';
}
