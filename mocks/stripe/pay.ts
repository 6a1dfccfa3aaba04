import type http from 'node:http';
import type { ApiContext } from './api';
import { checkCard, type CardInput } from './cards';
import { closedPage, notFoundPage, payPage } from './pay-page';
import { completeSession, declineSession } from './sessions';

const html = (res: http.ServerResponse, status: number, body: string) => {
	res.writeHead(status, {
		'content-type': 'text/html; charset=utf-8',
		'cache-control': 'no-store'
	});
	res.end(body);
};

/** GET shows the payment form; POST checks the card and pays, declines, or shows field messages. */
export async function handlePayPage(
	req: http.IncomingMessage,
	res: http.ServerResponse,
	url: URL,
	ctx: ApiContext,
	readBody: (req: http.IncomingMessage) => Promise<string>
) {
	const id = decodeURIComponent(url.pathname.slice('/pay/'.length));
	const session = ctx.state.sessions.get(id);
	if (!session) return html(res, 404, notFoundPage());
	if (session.status !== 'open')
		return html(res, session.status === 'complete' ? 200 : 410, closedPage(session));
	const items = ctx.state.lineItems.get(id) ?? [];
	if (req.method === 'GET') return html(res, 200, payPage(session, items));
	if (req.method !== 'POST') return html(res, 405, notFoundPage());

	const form = new URLSearchParams(await readBody(req));
	const values: CardInput = {
		number: form.get('number') ?? '',
		expiry: form.get('expiry') ?? '',
		cvc: form.get('cvc') ?? '',
		name: form.get('name') ?? ''
	};
	const result = checkCard(values, new Date(ctx.state.now() * 1000));
	if (!result.ok && 'fieldErrors' in result)
		return html(res, 400, payPage(session, items, { values, errors: result.fieldErrors }));
	if (!result.ok) {
		declineSession(ctx.state, session, result.decline);
		// Keep what was typed except the security code, as a real form would.
		return html(
			res,
			402,
			payPage(session, items, {
				values: { ...values, cvc: '' },
				declined: result.decline.message
			})
		);
	}
	completeSession(ctx.state, session, { name: values.name.trim() });
	ctx.webhooks.send('checkout.session.completed', session);
	res.writeHead(303, {
		location: session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id)
	});
	res.end();
}
