/**
 * A text cell a spreadsheet will not run: text a buyer typed that starts with `=`, `+`, `-`, `@`,
 * a tab or a carriage return is read as a formula by Excel, LibreOffice and Sheets, so it gets a
 * leading apostrophe (OWASP, "CSV Injection").
 */
export function csvText(s: string): string {
	return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}

/** Minor units as a plain decimal with the currency's own digits, no sign or grouping. */
export function csvAmount(minor: number, digits: number): string {
	const sign = minor < 0 ? '-' : '';
	const abs = Math.abs(minor);
	if (digits === 0) return `${sign}${abs}`;
	const s = String(abs).padStart(digits + 1, '0');
	return `${sign}${s.slice(0, -digits)}.${s.slice(-digits)}`;
}
