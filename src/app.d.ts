import type { PublicUser } from '$lib/server/db/schema';

declare global {
	namespace App {
		interface Error {
			message: string;
			/** A form refused for coming from another address: the same page at the shop's own. */
			address?: string;
		}
		interface Locals {
			user: Pick<PublicUser, 'id' | 'email' | 'name' | 'role'> | null;
			session: { id: string; expiresAt: Date } | null;
			/** Set by a throttled action: the hook sends it as `Retry-After` (seconds). */
			retryAfterS?: number;
		}
	}
}

export {};
