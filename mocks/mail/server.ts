/**
 * Mail stand-in: an SMTP server on loopback that keeps every message in memory, with an inbox page
 * and a JSON API on a second port. The app reaches it only through nodemailer.
 */
import http from 'node:http';
import type net from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { config } from '../../config/settings';
import { isMain, runUntilSignal } from '../run';
import { MailStore } from './store';
import { inboxPage, messagePage } from './pages';

export type MailServerOptions = {
	smtpPort?: number;
	httpPort?: number;
	host?: string;
};

const listen = (server: net.Server, port: number, host: string) =>
	new Promise<void>((resolve, reject) => {
		server.once('error', reject);
		server.listen(port, host, () => resolve());
	});

/** The refusal the stand-in gives a recipient, if any (see `onRcptTo`). */
export function refusalFor(address: string): { code: number; message: string } | null {
	const domain = address.split('@').pop()?.toLowerCase() ?? '';
	if (domain === 'refuse-permanent.test')
		return { code: 550, message: `5.1.1 <${address}>: no such mailbox here` };
	if (domain === 'refuse-temporary.test')
		return { code: 451, message: `4.3.0 <${address}>: mailbox busy, try again later` };
	return null;
}

export async function startMailServer(opts: MailServerOptions = {}) {
	const host = opts.host ?? '127.0.0.1';
	const store = new MailStore();

	const smtp = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS'],
		logger: false,
		// Accept any credentials: the stand-in must not reject a configured SMTP user.
		onAuth: (_auth, _session, cb) => cb(null, { user: 'local' }),
		// Refusals on demand, as a real server gives them (RFC 5321 §4.2.1: 5yz is permanent,
		// 4yz temporary): any recipient at refuse-permanent.test gets 550, at
		// refuse-temporary.test 451.
		onRcptTo(address, _session, cb) {
			const refusal = refusalFor(address.address);
			if (!refusal) return cb();
			const err = Object.assign(new Error(refusal.message), { responseCode: refusal.code });
			cb(err);
		},
		onData(stream, session, cb) {
			// Keep the bytes as sent too, so a test can parse the message itself.
			const chunks: Buffer[] = [];
			stream.on('data', (c: Buffer) => chunks.push(c));
			stream.on('error', (err) => cb(err));
			stream.on('end', () => {
				const raw = Buffer.concat(chunks);
				simpleParser(raw)
					.then((parsed) => {
						const to = session.envelope.rcptTo.map((r) => r.address);
						const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
						store.add(parsed, to, from, raw);
						cb();
					})
					.catch((err: Error) => cb(err));
			});
		}
	});

	const web = http.createServer((req, res) => {
		const url = new URL(req.url ?? '/', 'http://localhost');
		const json = (status: number, body: unknown) => {
			res.writeHead(status, { 'content-type': 'application/json' });
			res.end(JSON.stringify(body));
		};
		const html = (status: number, body: string) => {
			res.writeHead(status, { 'content-type': 'text/html; charset=utf-8' });
			res.end(body);
		};
		const path = url.pathname;
		const one = path.match(/^\/(api\/)?messages\/([^/]+)$/);
		const raw = path.match(/^\/api\/messages\/([^/]+)\/raw$/);
		if (req.method === 'GET' && raw) {
			const bytes = store.raw(raw[1]);
			if (!bytes) return json(404, { error: 'No message with that id' });
			res.writeHead(200, { 'content-type': 'message/rfc822' });
			return res.end(bytes);
		}

		if (req.method === 'GET' && path === '/api/messages')
			return json(200, store.list(url.searchParams.get('to')));
		if (req.method === 'DELETE' && path === '/api/messages') {
			store.clear();
			return json(200, { cleared: true });
		}
		if (req.method === 'GET' && one) {
			const m = store.get(one[2]);
			if (one[1]) return m ? json(200, m) : json(404, { error: 'No message with that id' });
			return m ? html(200, messagePage(m)) : html(404, 'No message with that id');
		}
		if (req.method === 'GET' && path === '/')
			return html(200, inboxPage(store.list(url.searchParams.get('to'))));
		if (req.method === 'POST' && path === '/clear') {
			store.clear();
			res.writeHead(303, { location: '/' });
			return res.end();
		}
		json(404, { error: 'Not found' });
	});

	await listen(smtp.server, opts.smtpPort ?? config.mail.port, host);
	await listen(web, opts.httpPort ?? config.mail.inboxPort, host);

	return {
		store,
		smtpPort: (smtp.server.address() as { port: number }).port,
		httpPort: (web.address() as { port: number }).port,
		close: () =>
			Promise.all([
				new Promise<void>((r) => smtp.close(() => r())),
				new Promise<void>((r) => {
					web.closeAllConnections();
					web.close(() => r());
				})
			]).then(() => undefined)
	};
}

if (isMain(import.meta.url)) {
	runUntilSignal('mail', async () => {
		const s = await startMailServer();
		console.log(
			`mail stand-in: SMTP 127.0.0.1:${s.smtpPort}, inbox http://127.0.0.1:${s.httpPort}/`
		);
		return s;
	});
}
