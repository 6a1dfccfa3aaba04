/**
 * Which pages a phone keeps for working without signal, shared by the service worker, the
 * offline page and the booth start page (the installed app's first page).
 */

/** The cache the kept pages live in (the booth page also stores itself here). */
export const KEPT_PAGES = 'chipstall-booth-pages';
export const OFFLINE_PAGE = '/offline';
/** Where the installed app opens: a page the phone keeps. */
export const START_PAGE = '/workshop/booth';

const KEPT = /^\/workshop\/(booth|fairs\/\d+\/(booth|tally))\/?$/;

export function isKeptPage(pathname: string): boolean {
	return KEPT.test(pathname);
}

/** The offline page, saying which address needed signal (only a path on this site). */
export function offlineAddress(from: string): string {
	const safe = from.startsWith('/') && !from.startsWith('//') ? from : '/workshop';
	return `${OFFLINE_PAGE}?from=${encodeURIComponent(safe)}`;
}

/** What a kept page is, in words, from its address. */
export function keptPageLabel(pathname: string, title: string | null): string {
	if (/\/tally\/?$/.test(pathname)) return title ?? 'A fair’s tally';
	if (/\/fairs\/\d+\/booth\/?$/.test(pathname)) return title ?? 'A fair’s booth';
	return 'Your fairs at the booth';
}
