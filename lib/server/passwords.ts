import "server-only";
import { hash, verify } from "@node-rs/argon2";

/**
 * argon2id with m = 19456 KiB, t = 2, p = 1.
 * Source: OWASP Password Storage Cheat Sheet (argon2id minimum configuration).
 */
export const ARGON2_OPTIONS = { algorithm: 2 /* Argon2id */, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;
const CURRENT_PARAMS = "$argon2id$v=19$m=19456,t=2,p=1$";

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

/** Whether a stored hash was made with weaker or other parameters and should be replaced at sign-in. */
export function needsRehash(passwordHash: string): boolean {
  return !passwordHash.startsWith(CURRENT_PARAMS);
}

let dummyHash: Promise<string> | undefined;

/** Spends the same work as a real check, so an unknown e-mail answers as slowly as a wrong password. */
export async function verifyDummy(password: string): Promise<void> {
  dummyHash ??= hashPassword("greaseledger-dummy-password-for-timing");
  await verifyPassword(await dummyHash, password);
}
