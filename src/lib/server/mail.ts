import nodemailer, { type Transporter } from 'nodemailer';
import { config } from './config';

export type OutgoingMail = {
	to: string | string[];
	subject: string;
	text: string;
	html?: string;
	replyTo?: string;
};

let transport: Transporter | undefined;

/** One SMTP transport per process, made on first use so tests can set the env first. */
export function mailTransport(): Transporter {
	transport ??= nodemailer.createTransport({
		host: config.mail.host,
		port: config.mail.port,
		secure: config.mail.secure,
		// Only authenticate when a user is configured; the local stand-in needs none.
		auth: config.mail.user ? { user: config.mail.user, pass: config.mail.password } : undefined
	});
	return transport;
}

/** Sends one message from the shop's address; resolves with the SMTP message id. */
export async function sendMail(mail: OutgoingMail): Promise<string> {
	const info = await mailTransport().sendMail({
		from: config.mail.from,
		...mail
	});
	return info.messageId;
}

/** Drops the cached transport (tests that change SMTP settings between runs). */
export function resetMailTransport() {
	transport?.close();
	transport = undefined;
}
