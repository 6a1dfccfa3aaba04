/** The small part of opentype.js (v2, ships no types) that the letter font loaders use. */
declare module 'opentype.js' {
	import type { FontLike } from '$lib/pattern/font';
	export function parse(buffer: ArrayBuffer): FontLike;
	const opentype: { parse: typeof parse };
	export default opentype;
}
