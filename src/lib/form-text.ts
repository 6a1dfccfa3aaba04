/**
 * A posted field as text for refilling a form: a file (or a missing field) gives the fallback
 * rather than "[object File]".
 */
export function formText(v: FormDataEntryValue | undefined, fallback = ''): string {
	return typeof v === 'string' ? v : fallback;
}
