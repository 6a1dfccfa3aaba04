/**
 * A posted field as text for refilling a form: a file (or a missing field) gives the fallback
 * rather than "[object File]".
 */
export function formText(v: FormDataEntryValue | undefined, fallback = ''): string {
	return typeof v === 'string' ? v : fallback;
}

/** Every posted text field by name (files dropped), ready for a zod schema and for refilling. */
export async function formTexts(request: Request): Promise<Record<string, string>> {
	const out: Record<string, string> = {};
	for (const [k, v] of (await request.formData()).entries()) if (typeof v === 'string') out[k] = v;
	return out;
}
