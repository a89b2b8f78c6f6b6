import { hash, verify, type Algorithm } from '@node-rs/argon2';

// argon2id with the OWASP-recommended minimum (19 MiB, 2 passes, 1 lane).
const OPTIONS = {
	algorithm: 2 as Algorithm, // Algorithm.Argon2id (a const enum: not importable under isolatedModules)
	memoryCost: 19456,
	timeCost: 2,
	parallelism: 1,
	outputLen: 32
};

export function passwordHash(password: string): Promise<string> {
	return hash(password, OPTIONS);
}

export async function passwordVerify(passwordHashValue: string, password: string): Promise<boolean> {
	try {
		return await verify(passwordHashValue, password);
	} catch {
		return false;
	}
}

let dummy: Promise<string> | undefined;

/** Spend the same time as a real check when the e-mail is unknown (no timing oracle). */
export async function passwordVerifyDummy(password: string): Promise<false> {
	dummy ??= passwordHash('dartelier-no-such-user');
	await passwordVerify(await dummy, password);
	return false;
}
