import type { CardFieldErrors, CardInput } from './cards';
import type { LineItem, Session } from './state';

/** The stand-in's own hosted payment page: plain, unbranded, clearly a local test page. */
const esc = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!
	);

export function money(minor: number, currency: string) {
	const fmt = new Intl.NumberFormat('en', {
		style: 'currency',
		currency: currency.toUpperCase()
	});
	// ISO 4217 minor units (2 for USD/EUR, 0 for JPY) as Intl knows them.
	const digits = fmt.resolvedOptions().maximumFractionDigits ?? 2;
	return fmt.format(minor / 10 ** digits);
}

const shell = (title: string, body: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${esc(title)}</title>
<style>
body{font:17px/1.5 system-ui,sans-serif;margin:0;background:#eef0ec;color:#1f2a24}
main{max-width:30rem;margin:2rem auto;padding:1.5rem;background:#fff;border:1px solid #cfd6cc;border-radius:6px}
h1{font-size:1.25rem;margin:0 0 .25rem}
.note{font-size:.85rem;color:#4d5b52;background:#f4f6f2;padding:.5rem .75rem;border-radius:4px}
table{width:100%;border-collapse:collapse;margin:1rem 0}
td{padding:.35rem 0;border-bottom:1px solid #e3e8e0}
td.n{text-align:right;white-space:nowrap}
tr.total td{font-weight:700;border-bottom:0}
label{display:block;margin-top:.9rem;font-weight:600}
input{display:block;width:100%;box-sizing:border-box;font:inherit;padding:.5rem;border:1px solid #9aa79d;border-radius:4px}
input:focus{outline:3px solid #2f6fb3;outline-offset:1px}
.row{display:flex;gap:.75rem}.row>div{flex:1}
.err{color:#a1261b;font-size:.9rem;margin:.2rem 0 0}
.declined{border:2px solid #a1261b;color:#a1261b;padding:.6rem .8rem;border-radius:4px;margin-top:1rem}
button{margin-top:1.25rem;width:100%;font:inherit;font-weight:700;padding:.7rem;border:0;border-radius:4px;background:#2d5a3d;color:#fff;cursor:pointer}
.back{display:block;margin-top:1rem;text-align:center}
</style></head><body><main>${body}</main></body></html>`;

function itemsTable(session: Session, items: LineItem[]) {
	const rows = items
		.map(
			(li) =>
				`<tr><td>${esc(li.description)}${li.quantity > 1 ? ` × ${li.quantity}` : ''}</td><td class="n">${money(li.amount_total, li.currency)}</td></tr>`
		)
		.join('');
	return `<table>${rows}<tr class="total"><td>Total</td><td class="n" data-total>${money(session.amount_total, session.currency)}</td></tr></table>`;
}

export type PayPageState = {
	values?: Partial<CardInput>;
	errors?: CardFieldErrors;
	declined?: string;
};

export function payPage(session: Session, items: LineItem[], state: PayPageState = {}) {
	const v = state.values ?? {};
	const field = (name: keyof CardInput, label: string, attrs: string) => {
		const err = state.errors?.[name];
		return `<div><label for="${name}">${label}</label>
<input id="${name}" name="${name}" value="${esc(v[name] ?? '')}" ${attrs}${err ? ` aria-invalid="true" aria-describedby="${name}-err"` : ''}>
${err ? `<p class="err" id="${name}-err">${esc(err)}</p>` : ''}</div>`;
	};
	const cancel = session.cancel_url
		? `<a class="back" href="${esc(session.cancel_url)}">Cancel and go back</a>`
		: '';
	return shell(
		'Pay by card',
		`<h1>Pay by card</h1>
<p class="note">Local test payment page. No real card is charged. Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.</p>
${session.customer_email ? `<p>Receipt to ${esc(session.customer_email)}</p>` : ''}
${itemsTable(session, items)}
${state.declined ? `<p class="declined" role="alert">${esc(state.declined)}</p>` : ''}
<form method="post" novalidate>
${field('number', 'Card number', 'inputmode="numeric" autocomplete="cc-number" placeholder="1234 1234 1234 1234"')}
<div class="row">${field('expiry', 'Expiry (MM/YY)', 'autocomplete="cc-exp" placeholder="MM/YY"')}
${field('cvc', 'Security code', 'inputmode="numeric" autocomplete="cc-csc" placeholder="123"')}</div>
${field('name', 'Name on card', 'autocomplete="cc-name"')}
<button type="submit">Pay ${money(session.amount_total, session.currency)}</button>
</form>${cancel}`
	);
}

export function closedPage(session: Session) {
	const paid = session.status === 'complete';
	const link = paid
		? `<a class="back" href="${esc(session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id))}">Back to the shop</a>`
		: session.cancel_url
			? `<a class="back" href="${esc(session.cancel_url)}">Back to the shop</a>`
			: '';
	return shell(
		paid ? 'Already paid' : 'Payment window closed',
		`<h1>${paid ? 'This order is already paid' : 'This payment window has closed'}</h1>
<p>${paid ? 'Nothing more to do here.' : 'The time to pay has run out. Start again from the shop.'}</p>${link}`
	);
}

export const notFoundPage = () =>
	shell('Not found', '<h1>No such payment</h1><p>Check the link you followed.</p>');
