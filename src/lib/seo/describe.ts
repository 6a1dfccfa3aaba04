/**
 * A page's meta description (what a search result or a shared link shows under the title):
 * plain text, one line, cut at a word near 155 characters with an ellipsis — common practice,
 * since search engines cut longer snippets there.
 */
export function metaDescription(text: string, max = 155): string {
	const one = text.replace(/\s+/g, ' ').trim();
	if (one.length <= max) return one;
	const cut = one.slice(0, max - 1);
	const space = cut.lastIndexOf(' ');
	return `${(space > max * 0.6 ? cut.slice(0, space) : cut).replace(/[\s,.;:–—-]+$/, '')}…`;
}
