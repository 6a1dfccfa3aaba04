import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * One way to write a form field: `<Field … />` from $lib/ui (label, input, hint and error, tied
 * together by `for`, `aria-describedby` and `aria-invalid`), or `<Field …>{#snippet children(f)}`
 * spreading `f` onto a select or text area. The older Input and TextField are gone.
 */
const src = path.resolve(__dirname, '../../src');

function files(dir: string): string[] {
	return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
		const p = path.join(dir, e.name);
		return e.isDirectory() ? files(p) : e.name.endsWith('.svelte') ? [p] : [];
	});
}

const pages = files(src).map((f) => ({
	name: path.relative(src, f).split(path.sep).join('/'),
	text: readFileSync(f, 'utf8')
}));

const usesOldParts = (text: string) => /\$lib\/ui\/(Input|TextField)\.svelte/.test(text);

/** `<Field …>` tags that open (not `/>`) and do not hand the field's attributes on. */
function bareChildren(text: string): number {
	let n = 0;
	for (const m of text.matchAll(/<Field\b(?:[^<>{}]|\{[^{}]*\})*?(\/?)>/g)) {
		if (m[1] === '/') continue;
		const after = text.slice(m.index + m[0].length).trimStart();
		if (!after.startsWith('{#snippet children(')) n++;
	}
	return n;
}

describe('one way to write a form field', () => {
	it('finds the pages with forms (so a moved tree cannot pass by being empty)', () => {
		const withField = pages.filter((p) => /<Field\b/.test(p.text)).map((p) => p.name);
		expect(withField).toContain('routes/(shop)/checkout/+page.svelte');
		expect(withField).toContain('routes/workshop/pieces/PieceFields.svelte');
	});

	it('no page imports Input or TextField', () => {
		const old = pages
			.filter((p) => !p.name.startsWith('lib/ui/'))
			.filter((p) => usesOldParts(p.text))
			.map((p) => p.name);
		expect(old).toEqual([]);
	});

	it('a Field with its own control hands it the label, hint and error links', () => {
		const loose = pages.filter((p) => bareChildren(p.text) > 0).map((p) => p.name);
		expect(loose).toEqual([]);
	});

	it('tells a wired control from a loose one (self-check)', () => {
		expect(bareChildren('<Field label="A" id="a" error={e(\'a\')} />')).toBe(0);
		expect(
			bareChildren('<Field label="A" id="a">\n\t{#snippet children(f)}<textarea {...f}>')
		).toBe(0);
		expect(bareChildren('<Field label="A" id="a">\n\t<select id="a"></select></Field>')).toBe(1);
	});
});
