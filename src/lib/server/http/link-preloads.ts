/**
 * A public page's largest paint is its lead photo, which the page asks for from its head
 * (`<link rel="preload" as="image" imagesrcset … fetchpriority="high">`, see PhotoPreload).
 * SvelteKit announces every script of the page in the `Link` header instead (RFC 8288), which
 * the browser acts on before it reads a byte of the HTML, while it holds back a header image
 * preload with `imagesrcset` until it knows the viewport. Over HTTP/1.1, six connections to one
 * host, the page's seventeen-odd scripts then took the connections and the photo waited behind
 * them. Moving the script preloads into the head, after the photo's, keeps them preloaded (no
 * import waterfall) while the photo is asked for first.
 */
const HEAD_END = '</head>';
const ENTRY = /^\s*<([^>]+)>\s*;(.*)$/;

/** Splits a Link header value at the commas between entries (none occur inside our URLs). */
function entries(link: string): string[] {
	return link.split(/,(?=\s*<)/).map((e) => e.trim());
}

/**
 * Returns the page with its `modulepreload` links in the head, after anything already there;
 * `headers` keeps the other Link entries (the stylesheet). Pages without an image preload are
 * returned unchanged.
 */
export function scriptPreloadsIntoHead(headers: Headers, html: string): string {
	const end = html.indexOf(HEAD_END);
	const link = headers.get('link');
	if (end < 0 || !link || !/<link\b[^>]*\bas="image"/.test(html.slice(0, end))) return html;
	const scripts: string[] = [];
	const rest: string[] = [];
	for (const entry of entries(link)) {
		const m = entry.match(ENTRY);
		if (m && /rel="?modulepreload"?/.test(m[2]) && !/["<>\s]/.test(m[1])) scripts.push(m[1]);
		else rest.push(entry);
	}
	if (!scripts.length) return html;
	if (rest.length) headers.set('link', rest.join(', '));
	else headers.delete('link');
	const tags = scripts.map((href) => `<link rel="modulepreload" href="${href}">`).join('\n\t\t');
	return `${html.slice(0, end)}\t${tags}\n\t${html.slice(end)}`;
}
