import { enqueueMail, sendNow } from './outbox';
import { deliverMail } from './transport';
import { esc } from './html';
import type { OutgoingMail } from './message';

export type { OutgoingMail } from './message';
import { shopWords } from '$lib/locale/shop-format';

/**
 * Sends one message from the shop's address. It is written to the outbox first and sent at
 * once when the SMTP server answers; when it does not, it stays in the outbox and a drainer
 * sends it later (null is returned then). Only if the database itself is unreachable is the
 * message handed straight to SMTP, so a password reset still works without MariaDB.
 */
export async function sendMail(unsigned: OutgoingMail): Promise<string | null> {
	const mail = withSignOff(unsigned);
	let id: number;
	try {
		id = await enqueueMail(mail);
	} catch {
		return deliverMail(mail);
	}
	return sendNow(id, deliverMail);
}

/**
 * Ends a message with the shop's sign-off from settings (nothing when it is empty): the last
 * paragraph of the HTML and the last line of the text.
 */
export function withSignOff(mail: OutgoingMail, signOff = shopWords().signOff): OutgoingMail {
	const line = signOff.trim();
	if (!line) return mail;
	const para = `<p style="margin-top:20px">${esc(line)}</p>`;
	const html = mail.html
		? /<\/body>/i.test(mail.html)
			? mail.html.replace(/(<\/div>\s*)?<\/body>/i, (end) => `${para}${end}`)
			: `${mail.html}${para}`
		: undefined;
	return { ...mail, text: `${mail.text.trimEnd()}\n\n${line}\n`, ...(html ? { html } : {}) };
}
