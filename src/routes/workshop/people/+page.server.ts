import { formFail, parseForm } from '$lib/forms/parse-form';
import { addHelperSchema, promoteSchema, removeHelperSchema } from '$lib/auth/auth-schema';
import { requireRole } from '$lib/server/auth/guard';
import { addHelper, listStaff, promoteCustomer, removeHelper } from '$lib/server/auth/staff';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const owner = requireRole(event, 'owner');
	return { staff: await listStaff(), me: owner.id };
};

export const actions: Actions = {
	add: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, addHelperSchema, { extra: { form: 'add' } });
		if (!parsed.ok) return parsed.failure;
		const { values } = parsed;
		const r = await addHelper(parsed.data);
		if (!r.ok) {
			return formFail(400, r.message, { form: 'add', errors: { [r.field]: [r.message] }, values });
		}
		return { form: 'add', done: `${r.user.name} can now sign in as a helper.` };
	},

	promote: async (event) => {
		requireRole(event, 'owner');
		const parsed = await parseForm(event.request, promoteSchema, { extra: { form: 'promote' } });
		if (!parsed.ok) return parsed.failure;
		const { values } = parsed;
		const r = await promoteCustomer(parsed.data.email);
		if (!r.ok) {
			const errors = { [r.field]: [r.message] };
			return formFail(400, r.message, { form: 'promote', errors, values });
		}
		return { form: 'promote', done: `${r.user.name} is now a helper.` };
	},

	remove: async (event) => {
		const owner = requireRole(event, 'owner');
		const parsed = await parseForm(event.request, removeHelperSchema, {
			extra: { form: 'remove' }
		});
		if (!parsed.ok) return parsed.failure;
		const r = await removeHelper(owner.id, parsed.data.userId);
		if (!r.ok) return formFail(400, r.message, { form: 'remove', errors: { userId: [r.message] } });
		return {
			form: 'remove',
			done: `${r.user.name} is no longer a helper and has been signed out of the workshop.`
		};
	}
};
