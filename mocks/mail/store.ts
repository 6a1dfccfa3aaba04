import type { ParsedMail, AddressObject } from 'mailparser';

export type StoredMessage = {
	id: string;
	from: string;
	to: string[];
	subject: string;
	text: string;
	html: string;
	date: string;
};

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
	if (!field) return [];
	const list = Array.isArray(field) ? field : [field];
	return list.flatMap((a) => a.value.map((v) => v.address ?? '').filter(Boolean));
}

/** In-memory message list; newest first. */
export class MailStore {
	private messages: StoredMessage[] = [];
	private seq = 0;
	private sources = new Map<string, Buffer>();

	add(parsed: ParsedMail, envelopeTo: string[], envelopeFrom: string, raw?: Buffer): StoredMessage {
		const to = addresses(parsed.to);
		const msg: StoredMessage = {
			id: String(++this.seq),
			from: parsed.from?.value[0]?.address || envelopeFrom,
			// Envelope recipients cover Bcc, which has no header.
			to: [...new Set([...to, ...envelopeTo].map((a) => a.toLowerCase()))],
			subject: parsed.subject ?? '',
			text: parsed.text ?? '',
			html: typeof parsed.html === 'string' ? parsed.html : '',
			date: (parsed.date ?? new Date()).toISOString()
		};
		this.messages.unshift(msg);
		if (raw) this.sources.set(msg.id, raw);
		return msg;
	}

	list(to?: string | null): StoredMessage[] {
		if (!to) return [...this.messages];
		const want = to.toLowerCase();
		return this.messages.filter((m) => m.to.includes(want));
	}

	get(id: string) {
		return this.messages.find((m) => m.id === id);
	}

	/** The message exactly as it came over SMTP. */
	raw(id: string): Buffer | undefined {
		return this.sources.get(id);
	}

	clear() {
		this.messages = [];
		this.sources.clear();
	}
}
