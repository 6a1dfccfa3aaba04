import { config } from '../config';
import { sendMail } from '../mail/send';
import { createResetToken } from './reset';

/**
 * Sends a reset link when the e-mail has an account and does nothing otherwise; the caller
 * shows the same answer either way, so the form does not reveal who has an account.
 */
export async function requestPasswordReset(email: string): Promise<void> {
	const reset = await createResetToken(email);
	if (!reset) return;
	const link = `${config.origin}/reset/${reset.token}`;
	const text = [
		`Hello ${reset.user.name},`,
		'',
		'Someone (we hope you) asked to reset the password of your Chipstall account.',
		'Open this link within one hour to choose a new one. It works once:',
		'',
		link,
		'',
		'If you did not ask for this, ignore this e-mail: your password stays as it is.'
	].join('\n');
	const html = `<p>Hello ${escapeHtml(reset.user.name)},</p>
<p>Someone (we hope you) asked to reset the password of your Chipstall account.
Open this link within one hour to choose a new one. It works once:</p>
<p><a href="${link}">${link}</a></p>
<p>If you did not ask for this, ignore this e-mail: your password stays as it is.</p>`;
	await sendMail({ to: reset.user.email, subject: 'Reset your Chipstall password', text, html });
}

function escapeHtml(s: string): string {
	return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
