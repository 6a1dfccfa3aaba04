/** Parse the shipped letter font's bytes into the GlyphSource the layout engine draws from. */
import opentype from 'opentype.js';
import { glyphSourceFromFont } from '../pattern/font';
import type { GlyphSource } from '../pattern/lettering';

export function parseLetterFont(bytes: ArrayBuffer | Uint8Array): GlyphSource {
	const buf =
		bytes instanceof Uint8Array
			? (bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer)
			: bytes;
	return glyphSourceFromFont(opentype.parse(buf));
}
