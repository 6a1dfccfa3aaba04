/**
 * A text cell a spreadsheet will not run: text a buyer typed that starts with `=`, `+`, `-`, `@`,
 * a tab or a carriage return is read as a formula by Excel, LibreOffice and Sheets, so it gets a
 * leading apostrophe (OWASP, "CSV Injection").
 */
export function csvText(s: string): string {
	return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}
