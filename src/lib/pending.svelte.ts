import type { ActionResult, SubmitFunction } from '@sveltejs/kit';

type TrackOptions = {
	/** Empty the form after a successful answer (default: keep what was typed). */
	reset?: boolean | (() => boolean);
	/** Runs after the page has the answer, e.g. to update the basket count. */
	after?: (result: ActionResult) => void | Promise<void>;
};

/**
 * The one `use:enhance` helper for forms with a pending state: it records which form is on its
 * way, so its button can say so and refuse a second click. Fields keep what was typed unless
 * `reset` says otherwise; password fields are emptied after every answer so a password never
 * lingers on screen.
 *
 *   const pending = new Pending();
 *   <form use:enhance={pending.submit}> … <Button pending={pending.active}>
 *   <form use:enhance={pending.track('ship')}> … <Button pending={pending.is('ship')}>
 */
export class Pending {
	/** The key of the form on its way; '' when none is. */
	which = $state('');

	get active(): boolean {
		return this.which !== '';
	}

	is(key: string): boolean {
		return this.which === key;
	}

	track(key: string, options: TrackOptions = {}): SubmitFunction {
		return ({ formElement }) => {
			this.which = key;
			return async ({ result, update }) => {
				const reset = typeof options.reset === 'function' ? options.reset() : options.reset;
				try {
					await update({ reset: reset ?? false });
					for (const input of formElement.querySelectorAll<HTMLInputElement>(
						'input[type=password]'
					)) {
						input.value = '';
					}
					await options.after?.(result);
				} finally {
					this.which = '';
				}
			};
		};
	}

	/** The plain case: one form, typed values kept. */
	submit: SubmitFunction = this.track('form');
}
