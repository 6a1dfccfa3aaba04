/**
 * The heading of the basket's notice after a refused card. The payment server's reason is
 * already a plain sentence ("Your card has insufficient funds."), so it is shown once, as the
 * heading, and never wrapped in another sentence that says the same; a reason missing or too
 * long for a heading falls back to the plain words.
 */
export const DECLINED = 'Your card was declined';

export function declineHeading(reason: string | null | undefined): string {
	// Only the first sentence: "An error occurred … card. Try again in a little bit." → the error.
	const first = (reason ?? '').trim().split(/(?<=\.)\s+/)[0] ?? '';
	const sentence = first.replace(/\.$/, '').trim();
	if (!sentence || sentence.length > 90) return DECLINED;
	return sentence;
}
