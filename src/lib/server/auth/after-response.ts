/**
 * Runs work after the answer has gone: the reset and sign-up forms must answer in the same time
 * whether or not the address has an account, so the look-up and the e-mail happen afterwards
 * (OWASP Authentication Cheat Sheet, "Authentication and error messages"; ASVS 4.0 V2.5.2).
 * Failures are logged for the owner; the visitor has already been told the same thing as everyone.
 */
export function afterResponse(label: string, work: () => Promise<void>): void {
	setImmediate(() => {
		work().catch((err) => console.error(`${label} failed`, err));
	});
}
