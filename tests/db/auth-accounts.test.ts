import { afterAll, describe, expect, it } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { sessions, users } from '$lib/server/db/schema';
import { createSessionFor, validateToken } from '$lib/server/auth/lucia';
import { authenticate, createAccount } from '$lib/server/auth/users';
import { addHelper, listStaff, promoteCustomer, removeHelper } from '$lib/server/auth/staff';

const made: string[] = [];
const fresh = (tag: string) => `${tag}-${crypto.randomUUID()}@example.test`;

async function account(tag: string, role: 'owner' | 'helper' | 'customer' = 'customer') {
	const r = await createAccount({
		name: `Test ${tag}`,
		email: fresh(tag),
		password: 'a long password',
		role
	});
	if (!r.ok) throw new Error('setup failed');
	made.push(r.user.id);
	return r.user;
}

afterAll(async () => {
	if (made.length) await db.delete(users).where(inArray(users.id, made));
	await db.$client.end();
});

describe('accounts', () => {
	it('stores an argon2id hash, never the password', async () => {
		const user = await account('hash');
		const [row] = await db.select().from(users).where(eq(users.id, user.id));
		expect(row.passwordHash.startsWith('$argon2id$')).toBe(true);
		expect(row.passwordHash).not.toContain('a long password');
	});

	it('signs in with the right password only, saying nothing about which part was wrong', async () => {
		const user = await account('signin');
		expect(await authenticate(user.email, 'a long password')).toEqual(user);
		expect(await authenticate(user.email, 'wrong password')).toBeNull();
		expect(await authenticate(fresh('nobody'), 'a long password')).toBeNull();
	});

	it('reports a taken e-mail, also when two sign-ups race on the unique index', async () => {
		const user = await account('dupe');
		const again = await createAccount({
			name: 'Again',
			email: user.email,
			password: 'another one!'
		});
		expect(again).toEqual({ ok: false, reason: 'email-taken' });

		const email = fresh('race');
		const both = await Promise.all(
			[1, 2, 3].map((n) =>
				createAccount({ name: `Racer ${n}`, email, password: 'racing password' })
			)
		);
		const winners = both.filter((r) => r.ok);
		expect(winners).toHaveLength(1);
		if (winners[0].ok) made.push(winners[0].user.id);
		expect(both.filter((r) => !r.ok)).toHaveLength(2);
	});
});

describe('staff', () => {
	it('adds a helper who can sign in with the temporary password', async () => {
		const email = fresh('newhelper');
		const r = await addHelper({ name: 'Nell Helper', email, password: 'temporary pass 1' });
		expect(r.ok).toBe(true);
		if (r.ok) made.push(r.user.id);
		expect((await authenticate(email, 'temporary pass 1'))?.role).toBe('helper');
		expect((await listStaff()).map((s) => s.email)).toContain(email);
	});

	it('does not add a helper over an existing account, pointing a customer to promotion', async () => {
		const customer = await account('existing');
		const r = await addHelper({ name: 'X', email: customer.email, password: 'temporary pass 1' });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toMatch(/customer account/);
		expect((await authenticate(customer.email, 'a long password'))?.role).toBe('customer');
	});

	it('promotes a customer, and refuses an unknown e-mail or someone already on staff', async () => {
		const customer = await account('promote');
		expect((await promoteCustomer(customer.email)).ok).toBe(true);
		expect((await authenticate(customer.email, 'a long password'))?.role).toBe('helper');
		expect(await promoteCustomer(customer.email)).toMatchObject({ ok: false, field: 'email' });
		expect(await promoteCustomer(fresh('ghost'))).toMatchObject({ ok: false, field: 'email' });
	});

	it('removes a helper: back to customer, every session ended', async () => {
		const owner = await account('owner', 'owner');
		const helper = await account('leaving', 'helper');
		const token = await createSessionFor(helper.id);
		const r = await removeHelper(owner.id, helper.id);
		expect(r.ok).toBe(true);
		expect((await validateToken(token)).session).toBeNull();
		expect(await db.select().from(sessions).where(eq(sessions.userId, helper.id))).toHaveLength(0);
		const [row] = await db.select({ role: users.role }).from(users).where(eq(users.id, helper.id));
		expect(row.role).toBe('customer');
	});

	it('will not remove the owner asking, another owner, or a customer', async () => {
		const owner = await account('owner2', 'owner');
		const other = await account('owner3', 'owner');
		const customer = await account('cust', 'customer');
		expect(await removeHelper(owner.id, owner.id)).toMatchObject({
			ok: false,
			message: 'You cannot remove yourself.'
		});
		expect(await removeHelper(owner.id, other.id)).toMatchObject({ ok: false });
		expect(await removeHelper(owner.id, customer.id)).toMatchObject({ ok: false });
		const roles = await db
			.select({ id: users.id, role: users.role })
			.from(users)
			.where(inArray(users.id, [owner.id, other.id]));
		expect(roles.every((r) => r.role === 'owner')).toBe(true);
	});
});
