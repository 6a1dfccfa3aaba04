/**
 * Keeps sales tax in one place: `src/lib/tax/` holds the rules and the one half-up rounding;
 * nothing else in the app, the scripts or the seed rounds tax or writes its own half-up, and the
 * old per-place functions are gone. Also the settings form's rate and basis (basis points, the
 * stored value read as per line when saved before the basis existed).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { percentBp, salesTaxForm, salesTaxSetting } from '$lib/settings/settings-schema';

function files(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const p = join(dir, name);
		return statSync(p).isDirectory() ? files(p) : /\.(ts|svelte)$/.test(p) ? [p] : [];
	});
}
const CODE = [...files('src'), ...files('scripts')]
	.filter((p) => !p.startsWith(join('src', 'lib', 'tax') + '/'))
	.map((p) => ({ p, lines: readFileSync(p, 'utf8').split('\n') }));

/** `file:line` for each line outside src/lib/tax matching every pattern given. */
const offending = (...res: RegExp[]) =>
	CODE.flatMap((f) =>
		f.lines.flatMap((l, i) => (res.every((re) => re.test(l)) ? [`${f.p}:${i + 1}`] : []))
	);

describe('sales tax is worked out in src/lib/tax only', () => {
	it('finds the module where this test looks', () => {
		expect(files(join('src', 'lib', 'tax'))).toContain(join('src', 'lib', 'tax', 'sales-tax.ts'));
		expect(CODE.length).toBeGreaterThan(50);
	});

	it('no Math rounding beside a tax amount or rate', () => {
		expect(offending(/Math\.(round|floor|ceil|trunc)\(/, /tax|rateBp/i)).toEqual([]);
	});

	it('no half-up written out by hand (the +half idiom or a second mulDivHalfUp)', () => {
		expect(offending(/Math\.floor\(\(\s*2\s*\*/)).toEqual([]);
		expect(offending(/\+\s*5_?000\)\s*\/\s*10_?000/)).toEqual([]);
		expect(offending(/function\s+mulDivHalfUp/)).toEqual([]);
	});

	it('the old per-place tax functions are gone', () => {
		expect(offending(/\b(lineTax|taxAdded|taxIncluded|getSalesTaxBp|setSalesTaxBp)\b/)).toEqual([]);
	});
});

describe('the sales-tax setting', () => {
	it('reads a typed percentage as basis points', () => {
		// 1 % = 100 basis points (the definition of a basis point).
		expect(percentBp.parse('7.25')).toBe(725);
		expect(percentBp.parse(' 7,25 ')).toBe(725);
		expect(percentBp.parse('7')).toBe(700);
		expect(percentBp.parse('0.5')).toBe(50);
		expect(percentBp.parse('0')).toBe(0);
	});

	it('refuses what is not a rate with a sentence', () => {
		for (const bad of ['seven', '7.255', '-1', '', '7%', '1e2']) {
			const r = percentBp.safeParse(bad);
			expect(r.success, bad).toBe(false);
			expect(r.error?.issues[0].message).toMatch(/^[A-Z].*\.$/);
		}
		expect(percentBp.safeParse('30').error?.issues[0].message).toMatch(/higher than any/);
	});

	it('takes the basis from the form and refuses any other', () => {
		expect(salesTaxForm.parse({ rate: '6.25', basis: 'invoice' })).toEqual({
			rate: 625,
			basis: 'invoice'
		});
		const r = salesTaxForm.safeParse({ rate: '6.25', basis: 'per-piece' });
		expect(r.error?.issues[0].path).toEqual(['basis']);
		expect(r.error?.issues[0].message).toMatch(/each line or once on the whole order\.$/);
		expect(salesTaxForm.safeParse({ rate: '6.25' }).success).toBe(false);
	});

	it('reads a value saved before the basis existed as per line, today’s behaviour', () => {
		expect(salesTaxSetting.parse({ rateBp: 725 })).toEqual({ rateBp: 725, basis: 'item' });
		expect(salesTaxSetting.parse({ rateBp: 725, basis: 'invoice' }).basis).toBe('invoice');
		expect(salesTaxSetting.safeParse({ rateBp: -5 }).success).toBe(false);
	});
});
