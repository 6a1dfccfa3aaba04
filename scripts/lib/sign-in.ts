/** Shared by the bench and the tests that drive built app processes over HTTP. */

/** Signs in through the real form on `base`; returns the session cookie ("name=value"). */
export async function signInCookie(base: string, email: string, password: string) {
	const res = await fetch(`${base}/signin`, {
		method: 'POST',
		redirect: 'manual',
		headers: {
			accept: 'text/html',
			origin: base,
			'content-type': 'application/x-www-form-urlencoded'
		},
		body: new URLSearchParams({ email, password })
	});
	if (res.status !== 303) throw new Error(`sign-in answered ${res.status}`);
	const cookie = res.headers.getSetCookie().find((c) => c.startsWith('chipstall_session='));
	if (!cookie) throw new Error('no session cookie');
	return cookie.split(';')[0];
}
