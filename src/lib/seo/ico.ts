/**
 * The ICO container (the format of /favicon.ico), holding PNG images as Windows Vista and every
 * browser since accept: a 6-byte header (reserved 0, type 1, count), one 16-byte entry per image
 * (width and height, 0 meaning 256; palette 0; planes 1; 32 bits per pixel; byte size; offset),
 * then the PNG files. Layout as Microsoft documents it ("Icons", ICONDIR / ICONDIRENTRY).
 */
export type IcoImage = { size: number; png: Uint8Array };

export function buildIco(images: IcoImage[]): Uint8Array {
	const head = 6 + 16 * images.length;
	const total = head + images.reduce((n, i) => n + i.png.length, 0);
	const out = new Uint8Array(total);
	const view = new DataView(out.buffer);
	view.setUint16(0, 0, true);
	view.setUint16(2, 1, true);
	view.setUint16(4, images.length, true);
	let offset = head;
	images.forEach((img, i) => {
		const e = 6 + 16 * i;
		view.setUint8(e, img.size >= 256 ? 0 : img.size);
		view.setUint8(e + 1, img.size >= 256 ? 0 : img.size);
		view.setUint8(e + 2, 0);
		view.setUint8(e + 3, 0);
		view.setUint16(e + 4, 1, true);
		view.setUint16(e + 6, 32, true);
		view.setUint32(e + 8, img.png.length, true);
		view.setUint32(e + 12, offset, true);
		out.set(img.png, offset);
		offset += img.png.length;
	});
	return out;
}

/** Reads the entries back (for tests and checks): size, byte length and where each PNG starts. */
export function readIcoEntries(bytes: Uint8Array) {
	const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
	if (view.getUint16(0, true) !== 0 || view.getUint16(2, true) !== 1) return null;
	const count = view.getUint16(4, true);
	return Array.from({ length: count }, (_, i) => {
		const e = 6 + 16 * i;
		return {
			width: view.getUint8(e) || 256,
			height: view.getUint8(e + 1) || 256,
			bits: view.getUint16(e + 6, true),
			length: view.getUint32(e + 8, true),
			offset: view.getUint32(e + 12, true)
		};
	});
}
