/** The SMTP connection: the outbox and `sendMail` both hand messages to it. */
import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';
import type { OutgoingMail } from './message';

let transport: Transporter | undefined;

/** One SMTP transport per process, made on first use so tests can set the env first. */
export function mailTransport(): Transporter {
	transport ??= nodemailer.createTransport({
		host: config.mail.host,
		port: config.mail.port,
		secure: config.mail.secure,
		// Only authenticate when a user is configured; the local stand-in needs none.
		auth: config.mail.user ? { user: config.mail.user, pass: config.mail.password } : undefined,
		// Bounded, so an outbox lease (LEASE_SECONDS, 30 s) always outlives one attempt.
		connectionTimeout: 5_000,
		greetingTimeout: 5_000,
		socketTimeout: 15_000
	});
	return transport;
}

/** Hands one message to the SMTP server; resolves with its message id. */
export async function deliverMail(mail: OutgoingMail): Promise<string> {
	const info = await mailTransport().sendMail({ from: config.mail.from, ...mail });
	return info.messageId;
}

/** Drops the cached transport (tests that change SMTP settings between runs). */
export function resetMailTransport() {
	transport?.close();
	transport = undefined;
}
