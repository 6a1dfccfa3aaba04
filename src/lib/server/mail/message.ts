/** One letter as the shop writes it, before it is queued or sent. */
export type OutgoingMail = {
	to: string | string[];
	subject: string;
	text: string;
	html?: string;
	replyTo?: string;
	/** Fixed when the message is queued, so a resend carries the same one. */
	messageId?: string;
};
