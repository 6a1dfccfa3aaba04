/**
 * DEVELOPERS.md: "a box never cuts what was typed without a word". A `maxlength` makes the
 * browser drop whatever is typed or pasted past it, silently (HTML Living Standard, "the
 * maxlength attribute": user agents may prevent the user from entering more). Fields leave the
 * limit to the server, which refuses with a sentence. The exceptions say so on screen.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(__dirname, '../../src');
/** Files allowed a maxlength, and why. */
const ALLOWED: Record<string, string> = {
	// 12, above the three letters a rosette takes: a fourth letter already shows a sentence.
	'lib/components/Personaliser.svelte': 'maxlength="12"',
	// The owner's layout planner: draws what is typed, sends no form.
	'routes/workshop/layout/+page.svelte': 'maxlength={3}'
};

function svelteFiles(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const full = path.join(dir, name);
		if (statSync(full).isDirectory()) return svelteFiles(full);
		return name.endsWith('.svelte') ? [full] : [];
	});
}

describe('no form field cuts text without a word', () => {
	it('no maxlength outside the stated exceptions', () => {
		const found: string[] = [];
		for (const file of svelteFiles(ROOT)) {
			const rel = path.relative(ROOT, file).split(path.sep).join('/');
			for (const m of readFileSync(file, 'utf8').matchAll(/maxlength=("[^"]*"|\{[^}]*\})/gi)) {
				if (ALLOWED[rel] !== m[0]) found.push(`${rel}: ${m[0]}`);
			}
		}
		expect(found).toEqual([]);
	});
	it('the personaliser says so past three letters', () => {
		const src = readFileSync(path.join(ROOT, 'lib/components/Personaliser.svelte'), 'utf8');
		expect(src).toContain('Three letters at most');
	});
});
