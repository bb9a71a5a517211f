import { hash, verify } from '@node-rs/argon2';

/**
 * argon2id with 19 MiB memory, 2 passes, 1 lane: the minimum configuration recommended by the OWASP Password
 * Storage Cheat Sheet (from memory). About 60 ms a hash on the development machine.
 */
const ARGON2ID = 2;
const OPTIONS = { algorithm: ARGON2ID, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * Spends the same effort as a real check when the e-mail is unknown, so the response time does not tell
 * whether an account exists.
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('sweepline-dummy-password-for-unknown-accounts');
  await verifyPassword(await dummyHash, password);
  return false;
}
