import type { StoredMessage } from './store';

const esc = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!
	);

const shell = (title: string, body: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${esc(title)}</title>
<style>
body{font:16px/1.5 system-ui,sans-serif;margin:0;background:#f6f1e8;color:#2f2418}
main{max-width:56rem;margin:0 auto;padding:1.5rem}
h1{font-size:1.4rem;margin:0 0 1rem}
a{color:#7a4a1e}
table{width:100%;border-collapse:collapse;background:#fffdf8}
td,th{padding:.5rem .75rem;border-bottom:1px solid #e3d8c6;text-align:left;vertical-align:top}
.meta{color:#6b5a46;font-size:.9rem}
iframe{width:100%;height:32rem;border:1px solid #e3d8c6;background:#fff}
pre{white-space:pre-wrap;background:#fffdf8;border:1px solid #e3d8c6;padding:1rem}
button{font:inherit;padding:.3rem .8rem}
</style></head><body><main>${body}</main></body></html>`;

export function inboxPage(messages: StoredMessage[]) {
	const rows = messages
		.map(
			(m) => `<tr><td><a href="/messages/${m.id}">${esc(m.subject || '(no subject)')}</a></td>
<td>${esc(m.to.join(', '))}</td><td class="meta">${esc(new Date(m.date).toLocaleString())}</td></tr>`
		)
		.join('');
	return shell(
		'Local mail inbox',
		`<h1>Local mail inbox <span class="meta">(${messages.length})</span></h1>
<p class="meta">Every message the app sends locally lands here; nothing leaves this machine.</p>
<form method="post" action="/clear"><button>Clear all</button></form>
<table><thead><tr><th>Subject</th><th>To</th><th>Received</th></tr></thead>
<tbody>${rows || '<tr><td colspan="3">No messages yet.</td></tr>'}</tbody></table>`
	);
}

export function messagePage(m: StoredMessage) {
	const html = m.html
		? `<h2>HTML</h2><iframe sandbox="" srcdoc="${esc(m.html)}" title="HTML body"></iframe>`
		: '';
	return shell(
		m.subject,
		`<p><a href="/">← Inbox</a></p><h1>${esc(m.subject || '(no subject)')}</h1>
<p class="meta">From ${esc(m.from)} to ${esc(m.to.join(', '))} · ${esc(new Date(m.date).toLocaleString())}</p>
${html}<h2>Plain text</h2><pre>${esc(m.text)}</pre>`
	);
}
