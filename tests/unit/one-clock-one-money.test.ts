/**
 * Keeps the rules of $lib/locale/dates, $lib/locale/money and $lib/locale/shop-format: the conversion of moments to
 * days and hours, and the writing of dates and amounts, live in those modules only; nothing of
 * the demo scenario is written into src/ (the seed in scripts/seed sets the shop's words).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_WORDS, useShopWords } from '$lib/locale/shop-format';
import { withSignOff } from '$lib/server/mail/send';
import { shippingMail } from '$lib/server/orders/shipping-mail';

function files(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const p = join(dir, name);
		return statSync(p).isDirectory() ? files(p) : /\.(ts|svelte)$/.test(p) ? [p] : [];
	});
}
const SRC = files('src').map((p) => ({ p, text: readFileSync(p, 'utf8') }));
const offenders = (re: RegExp, allowed: string[] = []) =>
	SRC.filter((f) => !allowed.includes(f.p) && re.test(f.text)).map((f) => f.p);

afterEach(() => useShopWords(DEFAULT_WORDS));

describe('one module for the clock, one for money', () => {
	it('no screen, e-mail or export picks its own zone or locale', () => {
		expect(
			offenders(/timeZone:\s*'UTC'|toISOString\(\)\.slice|getUTC(Hours|Day|Date)\(/, [
				'src/lib/locale/dates.ts',
				'src/lib/locale/shop-format.ts'
			])
		).toEqual([]);
		expect(
			offenders(/toLocale(Date|Time)?String\(|Intl\.DateTimeFormat/, ['src/lib/locale/dates.ts'])
		).toEqual([]);
		expect(offenders(/\(UTC\)|_utc\b/)).toEqual([]);
	});

	it('no currency code, division by 100 or number format outside money.ts', () => {
		expect(
			offenders(/'USD'/, [
				'src/lib/locale/money.ts',
				'src/lib/locale/shop-format.ts',
				'src/lib/server/db/schema.ts'
			])
		).toEqual([]);
		expect(offenders(/\/\s*100\b(?!\s*%)/, ['src/lib/locale/money.ts'])).toEqual([]);
		expect(offenders(/Intl\.NumberFormat|toFixed\(2\)/, ['src/lib/locale/money.ts'])).toEqual([]);
		expect(
			offenders(/\b(en|de)-[A-Z]{2}\b/, [
				'src/lib/locale/dates.ts',
				'src/lib/locale/shop-format.ts',
				'src/lib/settings/settings-schema.ts'
			])
		).toEqual([]);
	});

	it('finds no demo name in src/', () => {
		expect(offenders(/Hollis|Linden Ford|Wren|Marsh/)).toEqual([]);
	});
});

describe("the shop's words in e-mails", () => {
	const order = {
		ref: 'CS-TEST1',
		buyerName: 'Ada Reader',
		lines: [{ quantity: 1, title: 'Coaster', woodName: 'Basswood', initials: null }]
	};

	it('says "our workshop" with no town set, and names the town once it is set', () => {
		const plain = shippingMail(order as never, { carrier: 'USPS', trackingNumber: '9400' });
		expect(plain.text).toContain('left our workshop today');
		useShopWords({ owner: 'Sam', town: 'Elm <Falls>', signOff: '' });
		const named = shippingMail(order as never, { carrier: 'USPS', trackingNumber: '9400' });
		expect(named.text).toContain('left our workshop in Elm <Falls> today');
		expect(named.html).toContain('our workshop in Elm &lt;Falls&gt;');
	});

	it('ends every message with the sign-off from settings, escaped in HTML', () => {
		const mail = {
			to: 'a@b.test',
			subject: 's',
			text: 'Hello.\n',
			html: '<html><body><div><p>Hello.</p>\n</div></body></html>'
		};
		expect(withSignOff(mail)).toEqual(mail);
		useShopWords({ owner: 'Sam', town: '', signOff: 'With thanks — Sam & co' });
		const signed = withSignOff(mail);
		expect(signed.text).toBe('Hello.\n\nWith thanks — Sam & co\n');
		expect(signed.html).toBe(
			'<html><body><div><p>Hello.</p>\n<p style="margin-top:20px">With thanks — Sam &amp; co</p></div></body></html>'
		);
	});
});
