/** Small pieces every HTML e-mail of the shop shares: escaping and the page around the body. */
export const esc = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!
	);

export function mailButton(href: string, label: string) {
	return `<p><a href="${esc(href)}" style="display:inline-block;background:#9a4a22;color:#fffaf2;padding:10px 18px;border-radius:12px;text-decoration:none;font-weight:bold">${esc(label)}</a></p>`;
}

/** Wraps already-escaped body HTML in the shop's plain, readable letter layout. */
export function mailPage(bodyHtml: string) {
	return `<!doctype html><html><body style="margin:0;background:#f6efe3;color:#2e2118;font-family:Nunito,Segoe UI,sans-serif;font-size:17px;line-height:1.5">
<div style="max-width:560px;margin:0 auto;padding:24px">
${bodyHtml}
</div></body></html>`;
}
