import { expect } from '@playwright/test';

export type CaughtMail = {
	id: string;
	to: string[];
	subject: string;
	text: string;
	html?: string;
	date: string;
};

/** The mail stand-in's JSON list of caught messages. */
export const mailInboxUrl = () =>
	process.env.MAIL_INBOX_URL ||
	`http://127.0.0.1:${process.env.MAIL_INBOX_PORT || 8025}/api/messages`;

/** Waits until a message to `to` arrives and returns the newest one. */
export async function waitForMail(to: string, subject?: RegExp): Promise<CaughtMail> {
	let found: CaughtMail | undefined;
	await expect
		.poll(
			async () => {
				const res = await fetch(mailInboxUrl());
				const list = (await res.json()) as CaughtMail[];
				found = list.find(
					(m) =>
						m.to.some((t) => t.toLowerCase() === to.toLowerCase()) &&
						(!subject || subject.test(m.subject))
				);
				return Boolean(found);
			},
			{ timeout: 10_000, message: `an e-mail to ${to}` }
		)
		.toBe(true);
	return found!;
}

/**
 * The message exactly as it crossed SMTP, parsed with mailparser (a general-purpose reference
 * parser), so a test reads what a mail program would, not the stand-in's own summary.
 */
export async function parsedMail(mail: CaughtMail) {
	const { simpleParser } = await import('mailparser');
	const res = await fetch(
		mailInboxUrl().replace(/\/api\/messages$/, `/api/messages/${mail.id}/raw`)
	);
	expect(res.status).toBe(200);
	return simpleParser(Buffer.from(await res.arrayBuffer()));
}
