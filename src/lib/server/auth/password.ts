import { hash, verify, type Options } from '@node-rs/argon2';

/**
 * argon2id with the OWASP Password Storage Cheat Sheet's first recommended setting
 * (19 MiB, 2 passes, 1 lane). `algorithm: 2` is Argon2id: the package's `Algorithm` enum is a
 * type-only const enum, so it cannot be read at run time.
 */
const options: Options = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
	return hash(password, options);
}

/** False for a wrong password and for a stored value that is not a valid hash. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
	try {
		return await verify(passwordHash, password);
	} catch {
		return false;
	}
}

/**
 * Checked against when an e-mail has no account, so a sign-in for an unknown address takes
 * as long as one with a wrong password and timing does not tell which part was wrong.
 */
let decoy: Promise<string> | undefined;
export async function burnVerifyTime(password: string): Promise<void> {
	decoy ??= hashPassword('chipstall-decoy-password');
	await verifyPassword(await decoy, password);
}
