/**
 * Small rows the DB tests make for themselves (a wood, a piece offered in it) under a tag of
 * their own, and reading a message back from the mail stand-in with a general-purpose parser.
 */
import { simpleParser } from 'mailparser';
import { db } from '$lib/server/db';
import * as s from '$lib/server/db/schema';
import type { PieceKind } from '$lib/catalogue/kinds';
import { config } from '$lib/server/config';

export async function testWood(slug: string) {
	const [{ id }] = await db
		.insert(s.woods)
		.values({
			slug,
			name: `Wood ${slug}`,
			botanicalName: 'Tilia americana',
			specificGravityMilli: 370,
			densityKgM3: 414,
			sideHardnessN: 1800,
			priceAddOnMinor: 0,
			toneLight: '#f1e4c8',
			toneDark: '#c9ae82',
			character: 'test'
		})
		.$returningId();
	return id;
}

/** A 75 × 75 mm piece at 20.00 in `woodIds`, carved to order or not. */
export async function testPiece(
	slug: string,
	woodIds: number[],
	o: { title: string; kind: PieceKind; personalisable: boolean }
) {
	const [{ id }] = await db
		.insert(s.pieces)
		.values({
			slug,
			title: o.title,
			kind: o.kind,
			summary: 'test',
			description: 'test',
			lengthMm: 75,
			widthMm: 75,
			thicknessMm: 6,
			basePriceMinor: 2000,
			personalisable: o.personalisable,
			leadDays: 10,
			pattern: { diameterMm: 50, count: 1 },
			createdAt: new Date()
		})
		.$returningId();
	if (woodIds.length)
		await db.insert(s.pieceWoods).values(woodIds.map((woodId) => ({ pieceId: id, woodId })));
	return id;
}

const inbox = () => `http://127.0.0.1:${config.mail.inboxPort}/api/messages`;

/** The first message to `email` whose subject matches, parsed with mailparser; waits up to 5 s. */
export async function mailTo(email: string, subject: RegExp) {
	for (let i = 0; i < 100; i++) {
		const list = (await (await fetch(`${inbox()}?to=${encodeURIComponent(email)}`)).json()) as {
			id: string;
			subject: string;
		}[];
		const m = list.find((x) => subject.test(x.subject));
		if (m)
			return simpleParser(Buffer.from(await (await fetch(`${inbox()}/${m.id}/raw`)).arrayBuffer()));
		await new Promise((r) => setTimeout(r, 50));
	}
	throw new Error(`no mail to ${email} matching ${subject}`);
}
