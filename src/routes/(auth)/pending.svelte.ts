import type { SubmitFunction } from '@sveltejs/kit';

/**
 * `use:enhance` callback that tracks whether the form is on its way, so the button can say so
 * and refuse a second click. Other fields keep what the visitor typed; password fields are
 * emptied after each answer so a password never lingers on screen.
 */
export class Pending {
	active = $state(false);

	submit: SubmitFunction = ({ formElement }) => {
		this.active = true;
		return async ({ update }) => {
			await update({ reset: false });
			for (const input of formElement.querySelectorAll<HTMLInputElement>('input[type=password]')) {
				input.value = '';
			}
			this.active = false;
		};
	};
}
