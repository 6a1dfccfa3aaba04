import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailServer } from '../../mocks/mail/server';

let server: Awaited<ReturnType<typeof startMailServer>>;
let api: string;

beforeAll(async () => {
	server = await startMailServer({ smtpPort: 0, httpPort: 0 });
	api = `http://127.0.0.1:${server.httpPort}`;
	// config is read lazily, so pointing the app's mail module at this port is enough.
	process.env.SMTP_PORT = String(server.smtpPort);
	process.env.SMTP_HOST = '127.0.0.1';
});

afterAll(async () => {
	const { resetMailTransport } = await import('$lib/server/mail/smtp');
	resetMailTransport();
	await server.close();
});

describe('mail stand-in', () => {
	it('receives a nodemailer message from sendMail and lists it in the JSON API', async () => {
		const { sendMail } = await import('$lib/server/mail/send');
		await sendMail({
			to: 'ada.buyer@example.test',
			subject: 'Your rosette plate is on its way',
			text: 'Tracking number 1Z999',
			html: '<p>Tracking number <b>1Z999</b></p>'
		});
		await sendMail({
			to: ['other@example.test'],
			subject: 'Second',
			text: 'two'
		});

		const list = (await (await fetch(`${api}/api/messages`)).json()) as Array<
			Record<string, unknown> & { id: string }
		>;
		expect(list.map((m) => m.subject)).toEqual(['Second', 'Your rosette plate is on its way']);
		const first = list[1];
		expect(first.to).toEqual(['ada.buyer@example.test']);
		expect(first.from).toBe('shop@chipstall.test');
		expect(String(first.text).trim()).toBe('Tracking number 1Z999');
		expect(first.html).toContain('<b>1Z999</b>');
		expect(typeof first.date).toBe('string');

		const filtered = (await (
			await fetch(`${api}/api/messages?to=ADA.buyer@example.test`)
		).json()) as unknown[];
		expect(filtered).toHaveLength(1);

		const one = await fetch(`${api}/api/messages/${first.id}`);
		expect(((await one.json()) as { subject: string }).subject).toBe(
			'Your rosette plate is on its way'
		);
		expect((await fetch(`${api}/api/messages/999`)).status).toBe(404);

		const page = await (await fetch(`${api}/`)).text();
		expect(page).toContain('Your rosette plate is on its way');
		const html = await (await fetch(`${api}/messages/${first.id}`)).text();
		expect(html).toContain('Tracking number 1Z999');

		expect((await fetch(`${api}/api/messages`, { method: 'DELETE' })).status).toBe(200);
		expect(await (await fetch(`${api}/api/messages`)).json()).toEqual([]);
	});
});
