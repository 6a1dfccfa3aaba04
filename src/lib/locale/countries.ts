/** Countries we post to, ISO 3166-1 alpha-2; names come from Intl.DisplayNames. */
export const COUNTRIES = [
	'US',
	'CA',
	'MX',
	'GB',
	'IE',
	'DE',
	'FR',
	'NL',
	'BE',
	'DK',
	'SE',
	'NO',
	'FI',
	'AT',
	'CH',
	'IT',
	'ES',
	'PT',
	'PL',
	'CZ',
	'AU',
	'NZ',
	'JP'
] as const;

export function countryName(code: string, locale = 'en'): string {
	try {
		return new Intl.DisplayNames([locale], { type: 'region' }).of(code) ?? code;
	} catch {
		return code;
	}
}
