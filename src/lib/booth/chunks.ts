/**
 * Splits the waiting sales into batches the sync route takes: at most `maxCount` sales and at
 * most `maxBytes` of JSON body each (measured as UTF-8, as the server counts it). A single sale
 * larger than the byte limit goes alone; the server refuses it with a reason the phone shows.
 */
export function chunkByLimits<T>(items: T[], maxCount: number, maxBytes: number): T[][] {
	const enc = new TextEncoder();
	const shell = enc.encode('{"sales":[]}').length;
	const chunks: T[][] = [];
	let cur: T[] = [];
	let bytes = shell;
	for (const item of items) {
		const size = enc.encode(JSON.stringify(item)).length + 1; // the comma between entries
		if (cur.length && (cur.length >= maxCount || bytes + size > maxBytes)) {
			chunks.push(cur);
			cur = [];
			bytes = shell;
		}
		cur.push(item);
		bytes += size;
	}
	if (cur.length) chunks.push(cur);
	return chunks;
}
