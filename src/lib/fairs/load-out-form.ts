import { loadOutLineSchema } from './schemas';

export type LoadOutLine = { pieceId: number; woodId: number; quantity: number };

/**
 * The load-out form has one box per shelf row, named `take-<piece>-<wood>`; each filled box is
 * read on its own so the first bad one is named. Empty and zero boxes take nothing.
 */
export function loadOutLines(
	form: Record<string, string>
): { lines: LoadOutLine[] } | { error: string; key: string } {
	const lines: LoadOutLine[] = [];
	for (const [key, value] of Object.entries(form)) {
		const m = /^take-(\d+)-(\d+)$/.exec(key);
		if (!m || value.trim() === '' || value.trim() === '0') continue;
		const parsed = loadOutLineSchema.safeParse({ pieceId: m[1], woodId: m[2], quantity: value });
		if (!parsed.success) return { error: parsed.error.issues[0].message, key };
		lines.push(parsed.data);
	}
	return { lines };
}
