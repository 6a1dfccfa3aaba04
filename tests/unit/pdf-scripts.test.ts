/**
 * Every PDF prints the names and notes of the countries the shop ships to. Read back with PDF.js
 * (Mozilla's reader, from npm), the text must come out letter for letter: Polish, Czech and
 * German names (Unicode code points as written by their speakers), a Japanese address and a gift
 * note with an emoji. A character no embedded font has prints a visible placeholder.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { slipsPdf, type SlipPaper } from '$lib/server/pdf/packing-slip';
import type { SlipOrder } from '$lib/server/pdf/slip-data';
import { checklistPdf } from '$lib/server/fairs/checklist-pdf';
import { templatePdf } from '$lib/server/pdf/template';
import { PLACEHOLDER, unprintable } from '$lib/server/pdf/fonts';
import { computePattern } from '$lib/pattern';
import { letterFont } from '$lib/pattern/letter-font';
import { pdfText } from '../helpers/pdf-text';

const shop = { name: 'Test Workshop', email: 'shop@example.test', address: ['1 Bench Row'] };

const order = (ref: string, buyer: string, address: string[], giftNote: string): SlipOrder => ({
	ref,
	buyerName: buyer,
	address: [buyer, ...address],
	giftNote,
	currency: 'EUR',
	subtotalMinor: 4200,
	shippingMinor: 1500,
	taxMinor: 0,
	totalMinor: 5700,
	placedOn: '2026-12-01',
	readyBy: 'Friday, December 11, 2026',
	lines: [
		{
			title: 'Rosette bottle holder',
			woodName: 'Cherry',
			quantity: 1,
			unitPriceMinor: 4200,
			lineTotalMinor: 4200,
			initials: 'ŁW',
			style: null
		}
	]
});

// Names and places as their speakers write them (Polish ł, ś, ó, ź; Czech ř, ě, ů; German ß, ü).
const POLISH = order(
	'CS-PL1',
	'Łukasz Wiśniewski',
	['ul. Piotrkowska 12', '90-001 Łódź', 'Poland'],
	'Wszystkiego najlepszego! 🎉🎂'
);
const CZECH = order(
	'CS-CZ1',
	'Jiří Dvořák',
	['Náměstí Republiky 7', '301 00 Plzeň', 'Czechia'],
	'Všechno nejlepší, dědečku'
);
const GERMAN = order(
	'CS-DE1',
	'Jürgen Großmann',
	['Königstraße 3', '70173 Stuttgart', 'Germany'],
	'Für Oma 💐'
);
const JAPANESE = order(
	'CS-JP1',
	'山田 花子',
	['東京都渋谷区神南1-2-3', '150-0041', 'Japan'],
	'お誕生日おめでとう'
);

describe('PDFs in every script the shop ships to', { timeout: 90_000 }, () => {
	for (const paper of ['a4', 'letter', 'label'] as SlipPaper[]) {
		it(`packing slips on ${paper} print Polish, Czech, German and Japanese letters and emoji`, async () => {
			const text = await pdfText(
				await slipsPdf(shop, [POLISH, CZECH, GERMAN, JAPANESE], {
					paper,
					kind: 'packing',
					origin: 'http://localhost'
				})
			);
			for (const o of [POLISH, CZECH, GERMAN, JAPANESE]) {
				expect(text).toContain(o.buyerName);
				for (const line of o.address) expect(text).toContain(line);
			}
			expect(text).toContain('🎉🎂');
			expect(text).toContain('Für Oma 💐');
			expect(text).toContain('Všechno nejlepší, dědečku');
			expect(text).toContain('initials "ŁW"');
			expect(text).not.toContain('?');
		});
	}

	it('the gift slip prints the emoji note whole', async () => {
		const text = await pdfText(
			await slipsPdf(shop, [POLISH], { paper: 'label', kind: 'gift', origin: 'http://localhost' })
		);
		expect(text).toContain('Wszystkiego najlepszego! 🎉🎂');
		expect(text).not.toContain('?');
	});

	it('prints a visible placeholder for a script no font has, and says which characters', async () => {
		// Hangul is outside Nunito, Noto Sans JP and Noto Emoji (their @fontsource ranges).
		const note = 'Dla Ani 안녕';
		expect(unprintable(`${POLISH.buyerName} ${note}`)).toEqual(['안', '녕']);
		expect(unprintable(`${POLISH.buyerName} ${CZECH.buyerName} 山田 🎂`)).toEqual([]);
		const text = await pdfText(
			await slipsPdf(shop, [{ ...POLISH, giftNote: note }], {
				paper: 'a4',
				kind: 'gift',
				origin: 'http://localhost'
			})
		);
		expect(text).toContain(`Dla Ani ${PLACEHOLDER}${PLACEHOLDER}`);
	});

	it('the load-out checklist prints a fair in Łódź and pieces with Czech names', async () => {
		const text = await pdfText(
			await checklistPdf(
				{
					name: 'Jarmark Świętego Dominika',
					place: 'Łódź',
					startsOn: '2026-08-01',
					endsOn: '2026-08-02'
				},
				[{ title: 'Dřevěná rozeta', woodName: 'Třešeň', quantity: 3 }],
				'a4'
			)
		);
		expect(text).toContain('Load-out checklist: Jarmark Świętego Dominika');
		expect(text).toContain('Łódź');
		expect(text).toContain('Dřevěná rozeta, Třešeň');
	});

	it('the carving template prints a title in Polish', async () => {
		const r = computePattern(
			{ diameterMm: 60, count: 1, initials: 'LW', widthMm: 90, lengthMm: 120 },
			{ font: letterFont() }
		);
		const text = await pdfText(
			await templatePdf(r, { paper: 'a4', orderRef: 'CS-PL1', title: 'Deska dla Łukasza' })
		);
		expect(text).toContain('Carving layout — Deska dla Łukasza');
		expect(text).toContain('Order CS-PL1');
	});

	it('no PDF code draws with the WinAnsi-only standard fonts (DEVELOPERS.md, PDFs)', () => {
		const root = path.resolve(import.meta.dirname, '../../src');
		const files = readdirSync(root, { recursive: true, encoding: 'utf8' }).filter((f) =>
			/\.(ts|svelte)$/.test(f)
		);
		const offenders = files.filter((f) =>
			/StandardFonts|embedStandardFont/.test(readFileSync(path.join(root, f), 'utf8'))
		);
		expect(offenders).toEqual([]);
	});
});
