import 'server-only';
import { hash, verify } from '@node-rs/argon2';

// argon2id with the OWASP Password Storage Cheat Sheet's first recommended setting:
// m = 19 MiB (19456 KiB), t = 2, p = 1. (@node-rs/argon2 defaults to argon2id.)
export const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// A hash to verify against when the account does not exist, so that the response time does not
// reveal whether an e-mail address has an account.
let dummyHash: Promise<string> | undefined;
export function dummyPasswordHash(): Promise<string> {
  return (dummyHash ??= hashPassword('not-a-real-password-for-timing-only'));
}
