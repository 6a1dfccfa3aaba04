import { tick } from 'svelte';
import type { ActionResult, SubmitFunction } from '@sveltejs/kit';

/**
 * What the form said back (a field marked invalid, an alert, a confirmation): on a phone the form
 * may be taller than the screen, so the first of these is scrolled to the middle of the view
 * when it is not already in sight. The message itself is in a live region or an alert, so
 * screen readers hear it where it is.
 */
export async function revealAnswer(formElement: HTMLElement): Promise<void> {
	await tick();
	const said = (root: ParentNode, selector: string) =>
		Array.from(root.querySelectorAll<HTMLElement>(selector)).find(
			(el) => el.getAttribute('aria-invalid') === 'true' || el.textContent?.trim()
		);
	const target =
		said(formElement, '[aria-invalid="true"], [role="alert"]') ??
		said(formElement, '[role="status"]') ??
		// A page that says it above the form (a banner) rather than inside it.
		said(document, 'main [role="alert"]');
	if (!target) return;
	const box = target.getBoundingClientRect();
	const inView = box.top >= 0 && box.bottom <= window.innerHeight;
	if (!inView) target.scrollIntoView({ block: 'center', behavior: 'instant' });
}

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
		return ({ formElement, cancel }) => {
			// A second click (or Enter) while the first is on its way sends nothing.
			if (this.which !== '') return cancel();
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
				if (result.type === 'success' || result.type === 'failure') await revealAnswer(formElement);
			};
		};
	}

	/** The plain case: one form, typed values kept. */
	submit: SubmitFunction = this.track('form');
}
