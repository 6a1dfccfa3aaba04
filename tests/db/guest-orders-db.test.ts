/**
 * Guest orders gathering into an account, against the real MariaDB: only once the address is
 * proven by a link e-mailed to it (OWASP ASVS 4.0 V2.5.2 and the Authentication Cheat Sheet:
 * an address belongs to someone only once a message sent to it is answered — from memory), and
 * each order exactly once however many clicks or tabs race. E-mail addresses are compared
 * trimmed and case-blind: RFC 5321 §2.4 leaves the local part's case to the receiving host, but
 * treating it as case-blind is common practice for shops and mail providers alike.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { eq, inArray, like } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { carts, checkoutDetails, orders, pendingSignups, users } from '$lib/server/db/schema';
import { completeSignUp } from '$lib/server/auth/signup';
import { completeReset, createResetToken } from '$lib/server/auth/reset';
import { createAccount } from '$lib/server/auth/users';
import { generateToken, hashToken } from '$lib/server/auth/token';
import { confirmEmail, confirmedAccountFor, isEmailConfirmed } from '$lib/server/auth/guest-orders';
import {
	BASKET_LIFETIME_MS,
	checkoutDetailsFor,
	forgetStaleCheckoutDetails,
	saveCheckoutDetails
} from '$lib/server/cart/checkout-details';
import { testOrder } from '../helpers/fixtures';

const tag = `g${process.pid}${Date.now() % 100000}`;
const fresh = (n: string) => `${tag}-${n}@example.test`;
let refNo = 0;

/** A guest order row as checkout leaves it (the fields that matter here). */
async function guestOrder(email: string, userId: string | null = null) {
	const ref = `GT-${tag.slice(-6)}${refNo++}`.toUpperCase().slice(0, 16);
	await testOrder({
		ref,
		userId,
		email,
		buyerName: 'Guest Buyer',
		address: { line1: '3 Ferry Lane', city: 'Linden Ford', postcode: '05002', country: 'US' },
		subtotalMinor: 3200,
		shippingMinor: 800,
		totalMinor: 4000
	});
	return ref;
}

async function ownerOf(ref: string) {
	const [row] = await db.select({ userId: orders.userId }).from(orders).where(eq(orders.ref, ref));
	return row.userId;
}

async function pendingSignUp(email: string, expiresAt = new Date(Date.now() + 60_000)) {
	const token = generateToken();
	await db.insert(pendingSignups).values({
		id: hashToken(token),
		email,
		name: 'Tamsin Reed',
		// Never checked here: the account is made from the stored hash as it is.
		passwordHash: '$argon2id$v=19$m=19456,t=2,p=1$placeholder$placeholder',
		expiresAt
	});
	return token;
}

afterAll(async () => {
	await db.delete(orders).where(like(orders.email, `%${tag}%`));
	await db.delete(users).where(like(users.email, `${tag}%`));
	await db.$client.end();
});

describe('guest orders join an account once its address is proven', () => {
	it('the sign-up link used by five clicks at once makes one account and attaches each order once', async () => {
		const email = fresh('five');
		const mine = [
			await guestOrder(email),
			// Typed with capitals and stray spaces at some checkout: the same mailbox.
			await guestOrder(`  ${email.toUpperCase()} `)
		];
		const someoneElses = await guestOrder(fresh('other'));
		const token = await pendingSignUp(email);

		const results = await Promise.all([1, 2, 3, 4, 5].map(() => completeSignUp(token)));
		const ok = results.filter((r) => r.ok);
		expect(ok).toHaveLength(1);
		expect(results.filter((r) => !r.ok).map((r) => !r.ok && r.state)).toEqual([
			'unknown',
			'unknown',
			'unknown',
			'unknown'
		]);
		const userId = ok[0].ok ? ok[0].userId : '';
		expect(ok[0].ok && ok[0].attached).toBe(2);
		for (const ref of mine) expect(await ownerOf(ref)).toBe(userId);
		expect(await ownerOf(someoneElses)).toBeNull();
		expect(await isEmailConfirmed(userId)).toBe(true);
		expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
	});

	it('two sign-up links for one address opened at once: one account, the other link says taken', async () => {
		const email = fresh('two');
		const ref = await guestOrder(email);
		const [a, b] = [await pendingSignUp(email), await pendingSignUp(email)];
		const results = await Promise.all([completeSignUp(a), completeSignUp(b)]);
		const ok = results.filter((r) => r.ok);
		expect(ok).toHaveLength(1);
		expect(results.find((r) => !r.ok)).toEqual({ ok: false, state: 'taken' });
		expect(await ownerOf(ref)).toBe(ok[0].ok && ok[0].userId);
	});

	it('an expired link attaches nothing and makes no account', async () => {
		const email = fresh('late');
		const ref = await guestOrder(email);
		const token = await pendingSignUp(email, new Date(Date.now() - 1000));
		expect(await completeSignUp(token)).toEqual({ ok: false, state: 'expired' });
		expect(await ownerOf(ref)).toBeNull();
		expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
	});

	it('an account made without a link gathers nothing until a reset link proves the address', async () => {
		const email = fresh('unproven');
		const ref = await guestOrder(email);
		const made = await createAccount({ name: 'Orrin Vale', email, password: 'a long password' });
		if (!made.ok) throw new Error('setup failed');
		expect(await isEmailConfirmed(made.user.id)).toBe(false);
		expect(await ownerOf(ref)).toBeNull();
		expect(await confirmedAccountFor(db, email)).toBeNull();

		const reset = await createResetToken(email);
		expect(await completeReset(reset!.token, 'another long password')).toMatchObject({ ok: true });
		expect(await ownerOf(ref)).toBe(made.user.id);
		expect(await isEmailConfirmed(made.user.id)).toBe(true);
		expect(await confirmedAccountFor(db, ` ${email.toUpperCase()}`)).toBe(made.user.id);
	});

	it('confirming twice at once attaches each order once and never moves an attached order', async () => {
		const email = fresh('twice');
		const made = await createAccount({ name: 'Ida Marsh', email, password: 'a long password' });
		if (!made.ok) throw new Error('setup failed');
		const other = await createAccount({
			name: 'Other',
			email: fresh('owner'),
			password: 'a long password'
		});
		if (!other.ok) throw new Error('setup failed');
		const refs = [await guestOrder(email), await guestOrder(email), await guestOrder(email)];
		// Placed while signed in to another account: it stays with that account.
		const taken = await guestOrder(email, other.user.id);
		const counts = await Promise.all(
			[1, 2, 3, 4].map(() => db.transaction((tx) => confirmEmail(tx, made.user.id)))
		);
		expect(counts.reduce((a, b) => a + b, 0)).toBe(3);
		expect(counts.filter((n) => n > 0)).toEqual([3]);
		for (const r of refs) expect(await ownerOf(r)).toBe(made.user.id);
		expect(await ownerOf(taken)).toBe(other.user.id);
	});
});

describe("the checkout's details live with the basket", () => {
	const details = (name: string) => ({
		name,
		email: fresh('basket'),
		address: { line1: '9 Mill Row', city: 'Linden Ford', postcode: '05002', country: 'US' },
		giftNote: null
	});

	it('are stored, replaced by the next checkout, and deleted with the basket', async () => {
		const cartId = crypto.randomUUID();
		const now = new Date();
		await db.insert(carts).values({ id: cartId, createdAt: now, updatedAt: now });
		expect(await checkoutDetailsFor(cartId)).toBeNull();
		expect(await saveCheckoutDetails(cartId, details('First Name'))).toBe(true);
		expect(await saveCheckoutDetails(cartId, details('Second Name'))).toBe(true);
		expect((await checkoutDetailsFor(cartId))?.name).toBe('Second Name');
		await db.delete(carts).where(eq(carts.id, cartId));
		expect(await checkoutDetailsFor(cartId)).toBeNull();
	});

	it('sent from two tabs at once leave one row, one of the versions sent', async () => {
		const cartId = crypto.randomUUID();
		const now = new Date();
		await db.insert(carts).values({ id: cartId, createdAt: now, updatedAt: now });
		const names = ['Tab One', 'Tab Two', 'Tab Three', 'Tab Four'];
		const saved = await Promise.all(names.map((n) => saveCheckoutDetails(cartId, details(n))));
		expect(saved).toEqual([true, true, true, true]);
		const rows = await db.select().from(checkoutDetails).where(eq(checkoutDetails.cartId, cartId));
		expect(rows).toHaveLength(1);
		expect(names).toContain(rows[0].name);
		await db.delete(carts).where(eq(carts.id, cartId));
	});

	it('are not stored for a basket that does not exist', async () => {
		expect(await saveCheckoutDetails(crypto.randomUUID(), details('Nobody'))).toBe(false);
	});

	it('are swept once older than the basket cookie lasts, and not before', async () => {
		const now = new Date();
		const ids = [crypto.randomUUID(), crypto.randomUUID()];
		for (const id of ids) await db.insert(carts).values({ id, createdAt: now, updatedAt: now });
		await saveCheckoutDetails(
			ids[0],
			details('Old'),
			new Date(now.getTime() - BASKET_LIFETIME_MS - 60_000)
		);
		await saveCheckoutDetails(
			ids[1],
			details('Recent'),
			new Date(now.getTime() - BASKET_LIFETIME_MS + 60_000)
		);
		expect(await forgetStaleCheckoutDetails(now)).toBeGreaterThanOrEqual(1);
		expect(await checkoutDetailsFor(ids[0])).toBeNull();
		expect((await checkoutDetailsFor(ids[1]))?.name).toBe('Recent');
		await db.delete(carts).where(inArray(carts.id, ids));
		expect(
			await db.select().from(checkoutDetails).where(inArray(checkoutDetails.cartId, ids))
		).toHaveLength(0);
	});
});
