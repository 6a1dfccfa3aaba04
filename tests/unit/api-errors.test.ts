import { describe, expect, it } from 'vitest';
import { isHttpError, json } from '@sveltejs/kit';
import { toApiErrorResponse } from '$lib/server/http/api-errors';
import { requireRoleApi } from '$lib/server/auth/guard';

const read = async (r: Response) => ({ status: r.status, body: (await r.json()) as unknown });

describe('API error bodies', () => {
	it("turns SvelteKit's `{ message }` into `{ error }`, keeping status and fields", async () => {
		const r = await toApiErrorResponse(json({ message: 'Sign in first.' }, { status: 401 }));
		expect(await read(r)).toEqual({ status: 401, body: { error: 'Sign in first.' } });
		const withFields = await toApiErrorResponse(
			json({ message: 'Check the form.', fields: { qty: ['Too many.'] } }, { status: 400 })
		);
		expect(await read(withFields)).toEqual({
			status: 400,
			body: { error: 'Check the form.', fields: { qty: ['Too many.'] } }
		});
	});

	it('leaves a body that is already `{ error }` untouched', async () => {
		const original = json(
			{ error: 'Out of stock.', fields: { woodId: ['Gone.'] } },
			{ status: 409 }
		);
		const r = await toApiErrorResponse(original);
		expect(r).toBe(original);
	});

	it('replaces an HTML error page with JSON for the same status', async () => {
		const html = new Response('<html>403</html>', {
			status: 403,
			headers: { 'content-type': 'text/html' }
		});
		const r = await toApiErrorResponse(html);
		expect(r.headers.get('content-type')).toBe('application/json');
		expect(await read(r)).toEqual({
			status: 403,
			body: { error: 'Your account cannot use this.' }
		});
	});

	it('requireRoleApi answers 401 for nobody and 403 for the wrong role', () => {
		const url = new URL('http://localhost/api/workshop/orders');
		const attempt = (user: App.Locals['user']) => {
			try {
				requireRoleApi({ locals: { user, session: null }, url }, 'owner', 'helper');
				return 200;
			} catch (e) {
				if (isHttpError(e)) return e.status;
				throw e;
			}
		};
		expect(attempt(null)).toBe(401);
		expect(attempt({ id: 'c', email: 'c@example.test', name: 'C', role: 'customer' })).toBe(403);
		expect(attempt({ id: 'h', email: 'h@example.test', name: 'H', role: 'helper' })).toBe(200);
	});
});
