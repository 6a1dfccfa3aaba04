import { describe, expect, it } from 'vitest';
import { patternResponse } from '$lib/server/pattern/api';
import { personalisationSchema } from '$lib/pattern/pattern-schema';
import { letterFont } from '$lib/pattern/letter-font';

const font = letterFont();
const call = (q: string) => patternResponse(new URLSearchParams(q), font);

describe('GET /api/pattern', () => {
	it('returns the layout for good input', () => {
		const res = call('diameter=70&count=3&split=0&initials=hm&wood=cherry&width=100&length=300');
		expect(res.status).toBe(200);
		const body = res.body as Record<string, unknown>;
		expect(body.compassRadiusMm).toBe(35);
		expect((body.rosettes as unknown[]).length).toBe(3);
		expect(typeof body.svg).toBe('string');
		expect(body.svg as string).toContain('<svg');
		expect(body.chipCount).toBeGreaterThan(0);
		expect(body).not.toHaveProperty('drawing');
	});

	it.each([
		['diameter=abc&width=100&length=300', 'diameter'],
		['diameter=5&width=100&length=300', 'diameter'],
		['diameter=70&count=0&width=100&length=300', 'count'],
		['diameter=70&count=2.5&width=100&length=300', 'count'],
		['diameter=70&count=99&width=100&length=300', 'count'],
		['diameter=70&spacing=-3&width=100&length=300', 'spacing'],
		['diameter=70&split=maybe&width=100&length=300', 'split'],
		['diameter=70&initials=ABCD&width=100&length=300', 'initials'],
		['diameter=70&initials=A1&width=100&length=300', 'initials'],
		['diameter=70&wood=teak&width=100&length=300', 'wood'],
		['diameter=70&length=300', 'width'],
		['diameter=70&width=100&length=1e9', 'length']
	])('400 with a message for the field: %s', (q, field) => {
		const res = call(q);
		expect(res.status).toBe(400);
		if (res.status === 400) {
			expect(res.body.error).toBeTruthy();
			expect(res.body.fields[field]?.[0]).toBeTruthy();
		}
	});
});

describe('personalisation schema (shared with the cart)', () => {
	it('uppercases initials and accepts our woods only', () => {
		expect(
			personalisationSchema.parse({ initials: ' hm ', wood: 'walnut', style: 'split' })
		).toEqual({
			initials: 'HM',
			wood: 'walnut',
			style: 'split'
		});
		expect(personalisationSchema.safeParse({ initials: 'HM', wood: 'ebony' }).success).toBe(false);
		expect(personalisationSchema.safeParse({ initials: 'ÉL', wood: 'basswood' }).success).toBe(
			false
		);
		expect(personalisationSchema.safeParse({ initials: '', wood: 'basswood' }).success).toBe(false);
	});
});

describe('GET /api/pattern handler (route module)', () => {
	it('answers 200 JSON with letters drawn from the bundled font, and 400 with fields', async () => {
		const { GET } = await import('../../src/routes/api/pattern/+server');
		const call = (q: string) =>
			GET({
				url: new URL(`http://x/api/pattern?${q}`),
				getClientAddress: () => '192.0.2.10'
			} as unknown as Parameters<typeof GET>[0]) as Promise<Response>;
		const ok = await call('diameter=70&count=1&initials=ab&width=100&length=100');
		expect(ok.status).toBe(200);
		const body = (await ok.json()) as { letterCount: number; chips: { kind: string }[] };
		expect(body.letterCount).toBe(2);
		expect(body.chips.filter((c: { kind: string }) => c.kind === 'letter')).toHaveLength(2);
		const bad = await call('diameter=70&count=1&width=100&length=100&wood=oak-from-nowhere');
		expect(bad.status).toBe(400);
		const err = (await bad.json()) as { fields: Record<string, string[]> };
		expect(err.fields.wood[0]).toMatch(/woods/);
	});
});

describe('planner settings', () => {
	it('reads border offsets and refuses bad ones with a message', async () => {
		const { plannerSchema } = await import('$lib/pattern/pattern-schema');
		const base = { diameter: '70', width: '100', length: '300' };
		expect(plannerSchema.parse({ ...base, border: '1', offsets: '5, 2, 1.5' }).offsets).toEqual([
			5, 2, 1.5
		]);
		const bad = plannerSchema.safeParse({ ...base, offsets: '5;x', paper: 'a3' });
		expect(bad.success).toBe(false);
		const paths = bad.success ? [] : bad.error.issues.map((i) => i.path[0]);
		expect(paths).toEqual(expect.arrayContaining(['offsets', 'paper']));
	});
});
