/**
 * The mail outbox against the real database: with the SMTP server down when an order is paid,
 * the confirmation waits in the outbox; when the server is back, two drainers running at the
 * same time (as two app processes would) send it exactly once. The receiving side is
 * `smtp-server`, a general-purpose SMTP implementation from npm, not our own code.
 */
import { eq, like } from 'drizzle-orm';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { config } from '$lib/server/config';
import { sendMail } from '$lib/server/mail/send';
import { deliverMail, resetMailTransport } from '$lib/server/mail/smtp';
import { drainOutbox, enqueueMail, LEASE_SECONDS } from '$lib/server/mail/outbox';
import { POST } from '../../src/routes/api/payments/webhook/+server';
import { freePort } from '../../scripts/lib/services';
import { completedEvent, insertPendingOrder, signEvent } from '../helpers/payment-fixture';

const tag = `o${process.pid}${Date.now() % 100000}`;
const email = `outbox-${tag}@example.test`;
let port = 0;
const received: string[] = [];

function smtpOn(p: number) {
	const server = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS'],
		onData(stream, session, done) {
			let raw = '';
			stream.on('data', (c: Buffer) => (raw += c.toString()));
			stream.on('end', () => {
				received.push(raw);
				done();
			});
		}
	});
	return new Promise<SMTPServer>((resolve) => server.listen(p, '127.0.0.1', () => resolve(server)));
}

const outboxRows = () =>
	db
		.select()
		.from(s.outbox)
		.where(like(s.outbox.recipients, `%${tag}%`));

beforeAll(async () => {
	// Nothing listens here yet: the mail server is "down".
	port = await freePort(27000 + (process.pid % 1000));
	process.env.SMTP_HOST = '127.0.0.1';
	process.env.SMTP_PORT = String(port);
	resetMailTransport();
});

afterAll(() => resetMailTransport());

describe('outbox', () => {
	it('keeps the confirmation of an order paid while SMTP is down, then sends it once', async () => {
		const ref = `CS-${tag.slice(-6).toUpperCase().padStart(6, 'Q')}`;
		const orderId = await insertPendingOrder(db, ref, tag, email);
		const body = completedEvent(`evt_${tag}`, ref, tag);
		const request = new Request('http://localhost/api/payments/webhook', {
			method: 'POST',
			headers: { 'stripe-signature': signEvent(body, config.stripe.webhookSecret) },
			body
		});
		const res = await POST({ request } as Parameters<typeof POST>[0]);
		expect(res.status).toBe(200);
		const [order] = await db.select().from(s.orders).where(eq(s.orders.id, orderId));
		expect(order.status).toBe('paid');

		let rows = await outboxRows();
		expect(rows).toHaveLength(1);
		expect(rows[0].status).toBe('pending');
		expect(rows[0].subject).toContain(ref);
		expect(rows[0].lastError).toBeTruthy();

		// While the server is still down a drain sends nothing and keeps the row.
		await db.update(s.outbox).set({ claimedUntil: null }).where(eq(s.outbox.id, rows[0].id));
		expect(await drainOutbox(deliverMail)).toBe(0);
		expect((await outboxRows())[0].status).toBe('pending');

		const server = await smtpOn(port);
		try {
			await db.update(s.outbox).set({ claimedUntil: null }).where(eq(s.outbox.id, rows[0].id));
			// Two drainers at once, as two app processes would run them.
			const [a, b] = await Promise.all([drainOutbox(deliverMail), drainOutbox(deliverMail)]);
			expect(a + b).toBeGreaterThanOrEqual(1);
			const mine = received.filter((m) => m.includes(email));
			expect(mine).toHaveLength(1);
			expect(mine[0]).toContain(ref);
			rows = await outboxRows();
			expect(rows[0].status).toBe('sent');
			expect(rows[0].messageId).toBeTruthy();
			// A later round finds nothing left to send.
			await drainOutbox(deliverMail);
			expect(received.filter((m) => m.includes(email))).toHaveLength(1);
		} finally {
			await new Promise<void>((r) => server.close(() => r()));
		}
	});

	it('sends at once, through the outbox, when the server is up', async () => {
		const server = await smtpOn(port);
		try {
			const to = `direct-${tag}@example.test`;
			const id = await sendMail({ to, subject: `Direct ${tag}`, text: 'hello' });
			expect(id).toMatch(/@/);
			expect(received.filter((m) => m.includes(to))).toHaveLength(1);
			const [row] = await db.select().from(s.outbox).where(eq(s.outbox.recipients, to));
			expect(row.status).toBe('sent');
			expect(row.attempts).toBe(1);
		} finally {
			await new Promise<void>((r) => server.close(() => r()));
		}
	});

	it('a message whose sender died mid-send goes again only after its lease, with the same Message-ID, logged', async () => {
		// RFC 5322 §3.6.4: one message, one Message-ID; receivers may fold copies that share it.
		const to = `lease-${tag}@example.test`;
		const id = await enqueueMail({ to, subject: `Lease ${tag}`, text: 'hello' });
		const [row] = await db.select().from(s.outbox).where(eq(s.outbox.id, id));
		expect(row.messageId).toMatch(/^<[^@\s]+@[^>\s]+>$/);
		// Another process claimed it, handed it over maybe, and died before marking it.
		await db
			.update(s.outbox)
			.set({
				claimedBy: 'a-process-that-died',
				claimedUntil: new Date(Date.now() + (LEASE_SECONDS - 5) * 1000),
				attempts: 1
			})
			.where(eq(s.outbox.id, id));
		expect(LEASE_SECONDS).toBeLessThanOrEqual(30);
		const server = await smtpOn(port);
		const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
		try {
			await drainOutbox(deliverMail);
			expect(received.filter((m) => m.includes(to))).toHaveLength(0); // the lease still holds
			await db
				.update(s.outbox)
				.set({ claimedUntil: new Date(Date.now() - 1000) })
				.where(eq(s.outbox.id, id));
			await drainOutbox(deliverMail);
			const mine = received.filter((m) => m.includes(to));
			expect(mine).toHaveLength(1);
			expect(mine[0]).toMatch(
				new RegExp(`Message-ID: ${row.messageId!.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`, 'i')
			);
			expect(warn.mock.calls.flat().join(' ')).toContain(row.messageId!);
			const [after] = await db.select().from(s.outbox).where(eq(s.outbox.id, id));
			expect(after).toMatchObject({ status: 'sent', messageId: row.messageId, attempts: 2 });
		} finally {
			warn.mockRestore();
			await new Promise<void>((r) => server.close(() => r()));
		}
	});
});
