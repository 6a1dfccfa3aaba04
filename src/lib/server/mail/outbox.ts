import { randomUUID } from 'node:crypto';
import { and, desc, eq, ne, sql } from 'drizzle-orm';
import { db, type Tx } from '../db';
import { outbox } from '../db/schema';
import { config } from '../config';
import type { OutgoingMail } from './message';
import { deliverMail } from './transport';

/**
 * The outbox: every message is written to MariaDB before the SMTP server is asked to take it,
 * so mail survives an SMTP outage and an app restart. A row is sent by whoever claims it first
 * — the request that wrote it, or the drainer of any app process — with an atomic UPDATE that
 * sets a lease (claimed_by / claimed_until). Two processes can never hold the same lease, so a
 * row is sent once; a row whose sender died mid-way is retried when its lease runs out.
 *
 * Mail an order's change causes is written with `queueMail` inside the transaction that makes
 * the change, so the two commit or fail together; `sendQueued` then tries to send it at once.
 *
 * Duplicates are bounded: a message may go out a second time only when its sender died (or the
 * database went away) between handing it to SMTP and marking it sent, and then not before its
 * lease (`LEASE_SECONDS`) ran out, carrying the same Message-ID, which is fixed when the row is
 * written, and with a log line. A process that did hand a message over but could not mark it
 * remembers it and marks it without sending it again.
 */

/** How long a claim lasts. Longer than the transport's timeouts put together (see mail.ts). */
export const LEASE_SECONDS = 30;
/** After a failed attempt the wait doubles from this… */
export const FIRST_RETRY_SECONDS = 5;
/** …up to this, so a server that is down for a day is still tried every hour. */
export const MAX_RETRY_SECONDS = 3600;
/** Temporary failures are retried this long (from writing, or from the owner's "try again"). */
export const GIVE_UP_AFTER_SECONDS = 2 * 24 * 3600;
const BATCH = 20;

/** Seconds to wait after the `attempts`-th failed try: 5, 10, 20, … capped at an hour. */
export function retryDelaySeconds(attempts: number): number {
	const n = Math.max(1, attempts);
	// 2^10 × 5 s already passes the cap; bounding the exponent keeps the number finite.
	return Math.min(MAX_RETRY_SECONDS, FIRST_RETRY_SECONDS * 2 ** Math.min(n - 1, 20));
}

/**
 * A permanent refusal: the server answered with a 5yz reply code (RFC 5321 §4.2.1), e.g. 550
 * "no such mailbox". Sending the same message again cannot help. 4yz replies and connection
 * errors (no reply code) are temporary.
 */
export function isPermanentRefusal(err: unknown): boolean {
	const code = Number((err as { responseCode?: unknown })?.responseCode);
	return Number.isInteger(code) && code >= 500 && code <= 599;
}

export type Deliver = (mail: OutgoingMail) => Promise<string>;

type Row = typeof outbox.$inferSelect;

const asMail = (r: Row): OutgoingMail => ({
	to: r.recipients.split(',').map((s) => s.trim()),
	subject: r.subject,
	text: r.textBody,
	html: r.htmlBody ?? undefined,
	replyTo: r.replyTo ?? undefined,
	messageId: r.messageId ?? undefined
});

/** A Message-ID of our own (RFC 5322 §3.6.4), on the sender's domain. */
export function newMessageId(): string {
	const domain = /@([^>\s]+)>?\s*$/.exec(config.mail.from)?.[1] ?? 'chipstall.invalid';
	return `<${randomUUID()}@${domain}>`;
}

/** Writes one message to the outbox as pending (in `tx` when given); returns its id. */
export async function enqueueMail(mail: OutgoingMail, tx?: Tx): Promise<number> {
	const [{ id }] = await (tx ?? db)
		.insert(outbox)
		.values({
			recipients: (Array.isArray(mail.to) ? mail.to : [mail.to]).join(', '),
			subject: mail.subject,
			textBody: mail.text,
			htmlBody: mail.html ?? null,
			replyTo: mail.replyTo ?? null,
			// Fixed now, so a resend after a crash carries the same id and mail systems can fold it.
			messageId: mail.messageId ?? newMessageId(),
			createdAt: new Date()
		})
		.$returningId();
	return id;
}

/** Writes a message inside the caller's transaction: it exists exactly when the change does. */
export function queueMail(tx: Tx, mail: OutgoingMail): Promise<number> {
	return enqueueMail(mail, tx);
}

/**
 * After the transaction that queued them committed: tries to send the rows now. Never throws;
 * whatever is not sent stays for the drainer.
 */
export async function sendQueued(ids: number[]): Promise<void> {
	if (ids.length === 0) return;
	for (const id of ids) {
		try {
			await sendNow(id, deliverMail);
		} catch (err) {
			console.error('Queued mail left for the drainer', id, err);
		}
	}
}

/**
 * Rows this process handed to SMTP but could not mark sent (the database went away): marked
 * without a second send when next claimed here.
 */
const handedOver = new Map<number, string>();

const claimable = sql`${outbox.status} = 'pending' and (${outbox.claimedUntil} is null or ${outbox.claimedUntil} < utc_timestamp())`;

/** Claims pending rows (all due ones, or only `id`) for `token`; returns what was claimed. */
async function claim(token: string, id?: number): Promise<Row[]> {
	await db.execute(sql`update ${outbox}
		set ${outbox.claimedBy} = ${token},
			${outbox.claimedUntil} = utc_timestamp() + interval ${LEASE_SECONDS} second,
			${outbox.attempts} = ${outbox.attempts} + 1
		where ${claimable} ${id === undefined ? sql`` : sql`and ${outbox.id} = ${id}`}
		order by ${outbox.id} limit ${BATCH}`);
	return db
		.select()
		.from(outbox)
		.where(and(eq(outbox.claimedBy, token), eq(outbox.status, 'pending')));
}

async function sendClaimed(rows: Row[], token: string, deliver: Deliver) {
	let sent = 0;
	for (const row of rows) {
		try {
			let messageId = handedOver.get(row.id);
			if (!messageId) {
				// The batch's lease was set when it was claimed, and rows go one after another: a
				// slow server could let a later row's lease run out and another drainer send it
				// meanwhile. So each row's lease starts again just before its own try, and a row
				// whose claim was lost is left to whoever holds it now.
				const [renewed] = await db
					.update(outbox)
					.set({ claimedUntil: sql`utc_timestamp() + interval ${LEASE_SECONDS} second` })
					.where(
						and(eq(outbox.id, row.id), eq(outbox.claimedBy, token), eq(outbox.status, 'pending'))
					);
				if (renewed.affectedRows !== 1) continue;
				if (row.attempts > 1) {
					// An earlier try failed, or its sender never said how it went (then it may have
					// gone out): logged, and sent with the same Message-ID.
					console.warn(
						`Outbox: sending message ${row.id} ${row.messageId ?? ''} again (attempt ${row.attempts}${row.lastError ? `, last error: ${row.lastError}` : ', its lease ran out'})`
					);
				}
				messageId = await deliver(asMail(row));
				handedOver.set(row.id, messageId);
			}
			// Marked sent whoever holds the claim now: it went out. (Marking only under our own
			// token once let a lapsed lease lose the mark, forget the hand-over, and the next
			// claimant send the message a second time.)
			await db
				.update(outbox)
				.set({ status: 'sent', sentAt: new Date(), messageId, claimedBy: null, claimedUntil: null })
				.where(and(eq(outbox.id, row.id), ne(outbox.status, 'sent')));
			handedOver.delete(row.id);
			sent++;
		} catch (err) {
			if (handedOver.has(row.id)) throw err; // the database is away: the claim lapses, we retry
			await recordFailure(row, token, err);
		}
	}
	return sent;
}

/**
 * A failed try: a permanent refusal gives up at once; a temporary one waits (doubling) and
 * gives up once the retry window has passed. Given-up rows are listed for the owner on Today.
 */
async function recordFailure(row: Row, token: string, err: unknown) {
	const lastError = String((err as Error)?.message ?? err).slice(0, 500);
	const wait = retryDelaySeconds(row.attempts);
	const from = (row.retriedAt ?? row.createdAt).getTime();
	const giveUp =
		isPermanentRefusal(err) || Date.now() + wait * 1000 > from + GIVE_UP_AFTER_SECONDS * 1000;
	const mine = and(eq(outbox.id, row.id), eq(outbox.claimedBy, token));
	if (giveUp) {
		console.warn(`Outbox: gave up on message ${row.id} after ${row.attempts} tries: ${lastError}`);
		await db
			.update(outbox)
			.set({
				status: 'failed',
				failedAt: new Date(),
				lastError,
				claimedBy: null,
				claimedUntil: null
			})
			.where(mine);
		return;
	}
	await db
		.update(outbox)
		.set({
			lastError,
			claimedBy: null,
			claimedUntil: sql`utc_timestamp() + interval ${wait} second`
		})
		.where(mine);
}

export type UndeliveredMail = {
	id: number;
	recipients: string;
	subject: string;
	lastError: string | null;
	attempts: number;
	failedAt: Date | null;
};

/** Mail the outbox gave up on, newest first (the owner's list on Today). */
export function undeliveredMail(limit = 20): Promise<UndeliveredMail[]> {
	return db
		.select({
			id: outbox.id,
			recipients: outbox.recipients,
			subject: outbox.subject,
			lastError: outbox.lastError,
			attempts: outbox.attempts,
			failedAt: outbox.failedAt
		})
		.from(outbox)
		.where(eq(outbox.status, 'failed'))
		.orderBy(desc(outbox.failedAt), desc(outbox.id))
		.limit(limit);
}

/**
 * The owner's "try again": a given-up row is pending again, due now, with a fresh retry window.
 * Keeps its Message-ID. False when the row is not (or no longer) given up.
 */
export async function retryUndelivered(id: number): Promise<boolean> {
	const [res] = await db
		.update(outbox)
		.set({
			status: 'pending',
			attempts: 0,
			failedAt: null,
			retriedAt: new Date(),
			claimedBy: null,
			claimedUntil: null
		})
		.where(and(eq(outbox.id, id), eq(outbox.status, 'failed')));
	return res.affectedRows === 1;
}

/** Tries to send one row now (right after it was written); false leaves it for the drainer. */
export async function sendNow(id: number, deliver: Deliver): Promise<string | null> {
	const token = randomUUID();
	const rows = await claim(token, id);
	if (rows.length === 0) return null;
	await sendClaimed(rows, token, deliver);
	const [row] = await db
		.select({ messageId: outbox.messageId })
		.from(outbox)
		.where(and(eq(outbox.id, id), eq(outbox.status, 'sent')));
	return row?.messageId ?? null;
}

/** Sends every due pending row once; safe to run in several processes at the same time. */
export async function drainOutbox(deliver: Deliver): Promise<number> {
	let total = 0;
	for (;;) {
		const token = randomUUID();
		const rows = await claim(token);
		if (rows.length === 0) return total;
		const sent = await sendClaimed(rows, token, deliver);
		total += sent;
		if (sent < rows.length) return total; // the server is failing: wait for the next round
	}
}

/** Pending mail not yet sent (for tests and the workshop). */
export async function pendingCount(): Promise<number> {
	const [row] = await db
		.select({ n: sql<number>`count(*)`.mapWith(Number) })
		.from(outbox)
		.where(eq(outbox.status, 'pending'));
	return row?.n ?? 0;
}

/** One timer per process; every process may run it (claims keep them apart). */
export function startOutboxDrainer() {
	// One round at a time: a slow round is not joined by the next tick.
	let running = false;
	const timer = setInterval(() => {
		if (running) return;
		running = true;
		void drainOutbox(deliverMail)
			.catch((err) => console.error('Sending queued mail failed', err))
			.finally(() => (running = false));
	}, config.mail.outboxEveryMs);
	timer.unref();
	process.once('sveltekit:shutdown', () => clearInterval(timer));
}
