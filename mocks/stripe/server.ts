/**
 * Stripe stand-in: speaks the part of Stripe's REST API the app uses (Checkout Sessions, Payment
 * Intents, Refunds), serves its own plain payment page and sends signed webhooks to the app, so the
 * official `stripe` SDK works against it unchanged. State lives in memory for the process's life.
 */
import http from 'node:http';
import Stripe from 'stripe';
import { config } from '../../config/settings';
import { isMain, runUntilSignal } from '../run';
import { route } from './api';
import { checkKey } from './auth';
import { ApiError } from './errors';
import { parseForm } from './form';
import { newId } from './ids';
import { IdempotencyStore } from './idempotency';
import { handlePayPage } from './pay';
import { dueToExpire } from './sessions';
import { State } from './state';
import { Webhooks } from './webhooks';

export type StripeServerOptions = {
	port?: number;
	secretKey?: string;
	webhookSecret?: string;
	webhookUrl?: string;
	retryBaseMs?: number;
	maxAttempts?: number;
	/** How often open sessions are checked against their expires_at. */
	expiryCheckMs?: number;
};

const readBody = (req: http.IncomingMessage) =>
	new Promise<string>((resolve, reject) => {
		let size = 0;
		const chunks: Buffer[] = [];
		req.on('data', (c: Buffer) => {
			size += c.length;
			if (size > 1_000_000)
				reject(new ApiError(413, 'invalid_request_error', 'Request body too large.'));
			else chunks.push(c);
		});
		req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
		req.on('error', reject);
	});

export async function startStripeServer(opts: StripeServerOptions = {}) {
	const secretKey = opts.secretKey ?? config.stripe.secretKey;
	const state = new State();
	const idempotency = new IdempotencyStore();
	const webhooks = new Webhooks(state, {
		url:
			opts.webhookUrl ??
			(process.env.STRIPE_WEBHOOK_URL || `${config.origin}/api/payments/webhook`),
		secret: opts.webhookSecret ?? config.stripe.webhookSecret,
		apiVersion: Stripe.API_VERSION,
		retryBaseMs: opts.retryBaseMs ?? 500,
		maxAttempts: opts.maxAttempts ?? 8
	});
	let origin = '';
	const ctx = {
		state,
		webhooks,
		payUrl: (id: string) => `${origin}/pay/${id}`
	};

	const expireDue = () => {
		for (const s of dueToExpire(state)) {
			s.status = 'expired';
			s.url = null;
			webhooks.send('checkout.session.expired', s);
		}
	};

	const send = (
		res: http.ServerResponse,
		status: number,
		body: unknown,
		extra: Record<string, string> = {}
	) => {
		const text = typeof body === 'string' ? body : JSON.stringify(body, null, 2);
		res.writeHead(status, {
			'content-type': 'application/json',
			'request-id': newId('req', 14),
			'stripe-version': Stripe.API_VERSION,
			...extra
		});
		res.end(text);
	};

	async function handleApi(req: http.IncomingMessage, res: http.ServerResponse, url: URL) {
		const method = req.method ?? 'GET';
		checkKey(req.headers.authorization, secretKey);
		const raw = method === 'GET' || method === 'DELETE' ? url.search.slice(1) : await readBody(req);
		const key = method === 'POST' ? req.headers['idempotency-key'] : undefined;
		const fingerprint = `${method} ${url.pathname} ${raw}`;
		if (typeof key === 'string') {
			const saved = idempotency.lookup(key, fingerprint);
			if (saved)
				return send(res, saved.status, saved.body, {
					'idempotent-replayed': 'true',
					'idempotency-key': key
				});
		}
		expireDue();
		const body = JSON.stringify(route(ctx, method, url.pathname, parseForm(raw)), null, 2);
		if (typeof key === 'string') idempotency.save(key, { fingerprint, status: 200, body });
		send(res, 200, body, typeof key === 'string' ? { 'idempotency-key': key } : {});
	}

	function handleMock(req: http.IncomingMessage, res: http.ServerResponse, url: URL) {
		if (req.method === 'GET' && url.pathname === '/_mock/events')
			return send(res, 200, state.deliveries);
		if (req.method === 'POST' && url.pathname === '/_mock/advance') {
			// Moves the stand-in's clock forward, then expires what is due (tests of stock holds).
			const seconds = Number(url.searchParams.get('seconds'));
			if (!Number.isFinite(seconds) || seconds < 0)
				return send(res, 400, { error: 'seconds must be a number ≥ 0' });
			state.clockOffset += Math.floor(seconds);
			expireDue();
			return send(res, 200, { now: state.now() });
		}
		send(res, 404, { error: 'Not found' });
	}

	const server = http.createServer((req, res) => {
		const url = new URL(req.url ?? '/', 'http://localhost');
		const run = async () => {
			if (url.pathname.startsWith('/v1/')) return handleApi(req, res, url);
			if (url.pathname.startsWith('/pay/')) {
				expireDue();
				return handlePayPage(req, res, url, ctx, readBody);
			}
			if (url.pathname.startsWith('/_mock/')) return handleMock(req, res, url);
			throw new ApiError(
				404,
				'invalid_request_error',
				`Unrecognized request URL (${req.method}: ${url.pathname}).`
			);
		};
		run().catch((err) => {
			if (res.headersSent) return res.end();
			if (err instanceof ApiError) return send(res, err.status, err.body());
			send(res, 500, {
				error: { type: 'api_error', message: (err as Error).message }
			});
		});
	});

	await new Promise<void>((resolve, reject) => {
		server.once('error', reject);
		server.listen(opts.port ?? config.stripe.port ?? 12111, '127.0.0.1', () => resolve());
	});
	const port = (server.address() as { port: number }).port;
	origin = `http://127.0.0.1:${port}`;
	const sweeper = setInterval(expireDue, opts.expiryCheckMs ?? 5000);
	sweeper.unref();

	return {
		port,
		origin,
		state,
		close: () =>
			new Promise<void>((resolve) => {
				clearInterval(sweeper);
				webhooks.close();
				server.closeAllConnections();
				server.close(() => resolve());
			})
	};
}

if (isMain(import.meta.url)) {
	runUntilSignal('stripe', async () => {
		const s = await startStripeServer();
		console.log(`stripe stand-in: API ${s.origin}/v1, payment page ${s.origin}/pay/<session>`);
		return s;
	});
}
