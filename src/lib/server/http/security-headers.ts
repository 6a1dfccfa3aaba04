/**
 * Headers every response carries, whatever made it (page, API, PDF, photo, error, redirect).
 * Pages get their Content-Security-Policy from `kit.csp` in svelte.config.js (with a hash for
 * SvelteKit's own inline script); anything else gets a policy that allows nothing to run and
 * nobody to frame it. Sources: OWASP Secure Headers Project and the OWASP Content Security
 * Policy Cheat Sheet; OWASP ASVS 4.0 V14.4 (HTTP security headers).
 */
const ALWAYS: Record<string, string> = {
	'x-content-type-options': 'nosniff',
	'referrer-policy': 'strict-origin-when-cross-origin',
	'permissions-policy': 'camera=(), microphone=(), geolocation=(), payment=(), usb=()',
	// For browsers without CSP frame-ancestors.
	'x-frame-options': 'DENY'
};
const NON_PAGE_CSP = "default-src 'none'; frame-ancestors 'none'";
/** Two years, the HSTS preload list's minimum is one (from memory). */
const HSTS = 'max-age=63072000; includeSubDomains';

export function withSecurityHeaders(response: Response, https: boolean): Response {
	let res = response;
	try {
		applySecurityHeaders(res.headers, https);
	} catch {
		// A response with immutable headers (a fetched one passed through): copy it first.
		res = new Response(response.body, response);
		applySecurityHeaders(res.headers, https);
	}
	return res;
}

/** The same headers set on `headers` in place (the page cache stores them with a page). */
export function applySecurityHeaders(headers: Headers, https: boolean) {
	// A route may ask for stricter (a reset link's page sends no Referer at all).
	for (const [k, v] of Object.entries(ALWAYS)) if (!headers.has(k)) headers.set(k, v);
	if (!headers.has('content-security-policy')) headers.set('content-security-policy', NON_PAGE_CSP);
	if (https) headers.set('strict-transport-security', HSTS);
}
