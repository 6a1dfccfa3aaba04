/**
 * The outbox's retries against the real MariaDB and the mail stand-in (an `smtp-server` from npm
 * that refuses recipients at refuse-permanent.test with 550 and at refuse-temporary.test with
 * 451): permanent refusals give up after one try, temporary ones back off (doubling, capped)
 * and give up after the retry window; the owner can try a given-up message again.
 */
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startMailServer } from '../../mocks/mail/server';
import { actions, load } from '../../src/routes/workshop/+page.server';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import { deliverMail, resetMailTransport } from '$lib/server/mail/smtp';
import {
	drainOutbox,
	enqueueMail,
	GIVE_UP_AFTER_SECONDS,
	retryDelaySeconds,
	retryUndelivered,
	undeliveredMail
} from '$lib/server/mail/outbox';

const tag = `b${process.pid}${Date.now() % 100000}`;
let server: Awaited<ReturnType<typeof startMailServer>>;

const rowOf = async (id: number) =>
	(await db.select().from(s.outbox).where(eq(s.outbox.id, id)))[0];
/** Seconds from the database's clock to the row's next allowed try. */
const waitOf = async (id: number) => {
	const [r] = await db.execute(
		sql`select timestampdiff(second, utc_timestamp(), claimed_until) as w from outbox where id = ${id}`
	);
	return Number((r as unknown as { w: number }[])[0].w);
};
const due = (id: number) =>
	db
		.update(s.outbox)
		.set({ claimedUntil: new Date(Date.now() - 1000) })
		.where(eq(s.outbox.id, id));
const copiesTo = (to: string) => server.store.list(to);

beforeAll(async () => {
	server = await startMailServer({ smtpPort: 0, httpPort: 0 });
	process.env.SMTP_HOST = '127.0.0.1';
	process.env.SMTP_PORT = String(server.smtpPort);
	resetMailTransport();
	vi.spyOn(console, 'warn').mockImplementation(() => undefined);
});

afterAll(async () => {
	vi.restoreAllMocks();
	resetMailTransport();
	await server.close();
});

describe('outbox retries', () => {
	it('waits 5 s, doubling, capped at an hour', () => {
		// Common practice for retries (capped exponential backoff, as in the AWS Architecture
		// Blog's "Exponential Backoff and Jitter"): base × 2^(n−1), never above the cap.
		const expected = [5, 10, 20, 40, 80, 160, 320, 640, 1280, 2560, 3600, 3600];
		expect(expected.map((_, i) => retryDelaySeconds(i + 1))).toEqual(expected);
		expect(retryDelaySeconds(500)).toBe(3600);
		expect(GIVE_UP_AFTER_SECONDS).toBe(2 * 24 * 3600);
	});

	it('gives up on a permanent refusal (5yz) after the first try, and lists it for the owner', async () => {
		// RFC 5321 §4.2.1: a 5yz reply is a permanent negative completion — the same command
		// will not succeed if repeated, so the outbox must not try again.
		const to = `nobody-${tag}@refuse-permanent.test`;
		const id = await enqueueMail({ to, subject: `Refused ${tag}`, text: 'hello' });
		await drainOutbox(deliverMail);
		const row = await rowOf(id);
		expect(row).toMatchObject({ status: 'failed', attempts: 1, claimedBy: null });
		expect(row.lastError).toMatch(/550/);
		expect(row.failedAt).not.toBeNull();
		await db.update(s.outbox).set({ claimedUntil: null }).where(eq(s.outbox.id, id));
		await drainOutbox(deliverMail);
		expect((await rowOf(id)).attempts).toBe(1); // never claimed again
		const listed = (await undeliveredMail(100)).find((m) => m.id === id);
		expect(listed).toMatchObject({ recipients: to, subject: `Refused ${tag}` });
		expect(listed?.lastError).toMatch(/no such mailbox/);
		expect(copiesTo(to)).toHaveLength(0);
	});

	it('retries a temporary refusal (4yz) with a doubling wait, then gives up after the window', async () => {
		// RFC 5321 §4.2.1: a 4yz reply is transient — the same message may succeed later.
		const to = `busy-${tag}@refuse-temporary.test`;
		const id = await enqueueMail({ to, subject: `Busy ${tag}`, text: 'hello' });
		await drainOutbox(deliverMail);
		let row = await rowOf(id);
		expect(row).toMatchObject({ status: 'pending', attempts: 1 });
		expect(row.lastError).toMatch(/451/);
		const first = await waitOf(id);
		expect(first).toBeGreaterThanOrEqual(3);
		expect(first).toBeLessThanOrEqual(5);
		await drainOutbox(deliverMail); // not due yet
		expect((await rowOf(id)).attempts).toBe(1);
		await due(id);
		await drainOutbox(deliverMail);
		const second = await waitOf(id);
		expect((await rowOf(id)).attempts).toBe(2);
		expect(second).toBeGreaterThanOrEqual(8);
		expect(second).toBeLessThanOrEqual(10);
		// Written three days ago: past the two-day window, the next failure gives up.
		await db
			.update(s.outbox)
			.set({ createdAt: new Date(Date.now() - 3 * 24 * 3600 * 1000) })
			.where(eq(s.outbox.id, id));
		await due(id);
		await drainOutbox(deliverMail);
		row = await rowOf(id);
		expect(row).toMatchObject({ status: 'failed', attempts: 3 });
		expect(copiesTo(to)).toHaveLength(0);
	});

	it('"try again" sends a given-up message with its Message-ID, once', async () => {
		const to = `fixed-${tag}@example.test`;
		const id = await enqueueMail({ to, subject: `Again ${tag}`, text: 'hello' });
		// As the outbox leaves a message it gave up on (the mailbox has since been fixed).
		await db
			.update(s.outbox)
			.set({
				status: 'failed',
				attempts: 1,
				lastError: '550 no such mailbox',
				failedAt: new Date()
			})
			.where(eq(s.outbox.id, id));
		const before = await rowOf(id);
		await drainOutbox(deliverMail);
		expect(copiesTo(to)).toHaveLength(0);
		expect(await retryUndelivered(id)).toBe(true);
		expect(await retryUndelivered(id)).toBe(false); // a double tap changes nothing
		await drainOutbox(deliverMail);
		const after = await rowOf(id);
		expect(after).toMatchObject({ status: 'sent', messageId: before.messageId });
		expect(copiesTo(to)).toHaveLength(1);
		// RFC 5322 §3.6.4: the same message keeps its Message-ID when sent again.
		const raw = server.store.raw(copiesTo(to)[0].id)!.toString();
		expect(raw).toContain(`Message-ID: ${before.messageId}`);
		expect((await undeliveredMail(100)).some((m) => m.id === id)).toBe(false);
	});

	it('a message handed over while its lease lapsed and another process claimed it is still marked sent', async () => {
		const to = `lapsed-${tag}@example.test`;
		const id = await enqueueMail({ to, subject: `Lapsed ${tag}`, text: 'hello' });
		// The hand-over is slow: meanwhile the lease runs out and another process claims the row.
		const slow = async (mail: Parameters<typeof deliverMail>[0]) => {
			const messageId = await deliverMail(mail);
			await db
				.update(s.outbox)
				.set({ claimedBy: 'another-process', claimedUntil: new Date(Date.now() + 60_000) })
				.where(eq(s.outbox.id, id));
			return messageId;
		};
		await drainOutbox(slow);
		expect((await rowOf(id)).status).toBe('sent');
		await due(id);
		await drainOutbox(deliverMail);
		expect(copiesTo(to)).toHaveLength(1);
	});

	it('Today lists given-up mail to the owner only; only the owner may try again; bad ids get a 400', async () => {
		const to = `page-${tag}@refuse-permanent.test`;
		const id = await enqueueMail({ to, subject: `Page ${tag}`, text: 'hello' });
		await drainOutbox(deliverMail);
		const [o] = await db.select().from(s.users).where(eq(s.users.role, 'owner')).limit(1);
		const [h] = await db.select().from(s.users).where(eq(s.users.role, 'helper')).limit(1);
		const event = (user: typeof o, body?: Record<string, string>) =>
			({
				locals: { user },
				url: new URL('http://localhost/workshop?/retryMail'),
				request: new Request('http://localhost', {
					method: 'POST',
					body: new URLSearchParams(body ?? {})
				})
			}) as never;
		type Loaded = { undelivered: { id: number; recipients: string }[] };
		const seen = (await load(event(o))) as Loaded;
		expect(seen.undelivered.find((m) => m.id === id)?.recipients).toBe(to);
		expect(((await load(event(h))) as Loaded).undelivered).toEqual([]);
		await expect(actions.retryMail(event(h, { id: String(id) }))).rejects.toMatchObject({
			status: 403
		});
		expect(await actions.retryMail(event(o, { id: 'abc' }))).toMatchObject({ status: 400 });
		// Tried again at once, refused again (550), so it is back on the list with one more try.
		await actions.retryMail(event(o, { id: String(id) }));
		const row = await rowOf(id);
		expect(row).toMatchObject({ status: 'failed', attempts: 1 });
		expect(row.retriedAt).not.toBeNull();
	});

	it('a row whose batch lease ran out while earlier rows were sent is not sent again by this drainer', async () => {
		const first = `slow-${tag}@example.test`;
		const second = `later-${tag}@example.test`;
		const a = await enqueueMail({ to: first, subject: `Slow ${tag}`, text: 'hello' });
		const b = await enqueueMail({ to: second, subject: `Later ${tag}`, text: 'hello' });
		// The first row's hand-over is slow; meanwhile the second row's lease runs out and another
		// drainer (the next tick, or another process) claims and sends it.
		const slow = async (mail: Parameters<typeof deliverMail>[0]) => {
			const messageId = await deliverMail(mail);
			if (String(mail.to).includes(first)) {
				await due(b);
				await drainOutbox(deliverMail);
			}
			return messageId;
		};
		await drainOutbox(slow);
		expect((await rowOf(a)).status).toBe('sent');
		expect((await rowOf(b)).status).toBe('sent');
		expect(copiesTo(first)).toHaveLength(1);
		expect(copiesTo(second)).toHaveLength(1);
	});
});
