/**
 * The confirmation e-mail's care words follow the pieces in the order. The message is built
 * as the app builds it, composed into RFC 5322 bytes by nodemailer's MailComposer and read back
 * by mailparser (an outside reader), against the seeded demo orders: CS-1004 is a wall plate
 * (a plate, but not for food), CS-1005 a serving plate finished for food, CS-1003 ornaments.
 */
import { describe, expect, it } from 'vitest';
import MailComposer from 'nodemailer/lib/mail-composer';
import { simpleParser } from 'mailparser';
import { confirmationMail } from '$lib/server/orders/mail';
import { orderByRef } from '$lib/server/orders/views';
import { mailOrder } from '$lib/server/orders/mail-order';
import { shippingMail } from '$lib/server/orders/shipping-mail';

/** The "on its way" e-mail as the buyer's mail program reads it. */
async function parsedShipping(ref: string) {
	const detail = await orderByRef(ref);
	if (!detail) throw new Error(`demo order ${ref} missing`);
	const order = await mailOrder(detail.id);
	const mail = shippingMail(order, { carrier: 'USPS', trackingNumber: '9400100000000000000000' });
	const raw = await new MailComposer({ from: 'shop@chipstall.test', to: order.email, ...mail })
		.compile()
		.build();
	const parsed = await simpleParser(raw);
	return { text: parsed.text ?? '', html: String(parsed.html || '') };
}

async function parsedConfirmation(ref: string) {
	const order = await orderByRef(ref);
	if (!order) throw new Error(`demo order ${ref} missing`);
	const mail = confirmationMail(order, 'http://localhost:3000');
	const raw = await new MailComposer({
		from: 'shop@chipstall.test',
		to: order.email,
		...mail
	})
		.compile()
		.build();
	const parsed = await simpleParser(raw);
	return { text: parsed.text ?? '', html: String(parsed.html || '') };
}

// Food-safe advice is hand washing, no dishwasher and food-grade mineral oil (common practice
// for wooden kitchenware); a display finish is not for food at all.
const FOOD = [/food-grade mineral oil/i, /dishwasher/i];

describe('confirmation e-mail care text', () => {
	it('gives a display piece display care and no food advice', async () => {
		const { text, html } = await parsedConfirmation('CS-1004');
		for (const body of [text, html]) {
			expect(body).toContain('For display');
			expect(body).toMatch(/not made for food/i);
			for (const re of FOOD) expect(body).not.toMatch(re);
			// It carries initials, so the letters get their own line.
			expect(body).toMatch(/initials are cut as chips/i);
		}
	});

	it('gives a food piece the food-safe care', async () => {
		const { text, html } = await parsedConfirmation('CS-1005');
		for (const body of [text, html]) {
			expect(body).toContain('For food');
			for (const re of FOOD) expect(body).toMatch(re);
			expect(body).not.toContain('For display');
		}
	});

	it('gives ornaments hanging care, without food advice', async () => {
		const { text } = await parsedConfirmation('CS-1003');
		expect(text).toContain('For hanging');
		for (const re of FOOD) expect(text).not.toMatch(re);
		// Plain ornaments, no initials: no line about carved letters.
		expect(text).not.toMatch(/initials are cut as chips/i);
	});

	it('says which advice goes with which piece in a mixed order', async () => {
		// CS-1006: a bottle holder (display) and a coffee scoop (for food).
		const { text } = await parsedConfirmation('CS-1006');
		expect(text).toMatch(/For food \(Coffee scoop\): /);
		expect(text).toMatch(/For display \([^)]*bottle holder[^)]*\): /i);
		expect(text).not.toMatch(/For food \([^)]*bottle holder/i);
	});

	it('names the nut-tree woods for every order', async () => {
		const { text } = await parsedConfirmation('CS-1005');
		// Walnut and butternut are nut trees (Juglans nigra, Juglans cinerea: common practice).
		expect(text).toMatch(/walnut and butternut are nut trees/);
	});
});

describe('shipping e-mail care text', () => {
	// Soaking and hand-washing are kitchenware advice (common practice); a display piece is dusted.
	const KITCHEN = [...FOOD, /wash (it )?by hand/i, /\boil (it|the piece)\b/i];

	it('tells the buyer of a display-only bottle holder nothing about oil or washing', async () => {
		// CS-1004 is a wall plate (display); CS-1006 holds a bottle holder (display) and a scoop.
		const { text, html } = await parsedShipping('CS-1004');
		for (const body of [text, html]) {
			expect(body).toContain('For display');
			for (const re of KITCHEN) expect(body).not.toMatch(re);
		}
		const mixed = await parsedShipping('CS-1006');
		expect(mixed.text).toMatch(/For display \([^)]*bottle holder[^)]*\): /i);
		expect(mixed.text).toMatch(/For food \(Coffee scoop\): /);
		expect(mixed.text).not.toMatch(/For food \([^)]*bottle holder/i);
	});

	it('gives a food piece the food-safe care, as the paid e-mail does', async () => {
		const ship = await parsedShipping('CS-1005');
		const paid = await parsedConfirmation('CS-1005');
		for (const re of FOOD) expect(ship.text).toMatch(re);
		const line = (t: string) => t.split('\n').find((l) => l.startsWith('For food'));
		expect(line(ship.text)).toBe(line(paid.text));
	});
});
