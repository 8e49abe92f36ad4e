import { hash, verify } from '@node-rs/argon2';

/**
 * argon2id with m = 19456 KiB, t = 2, p = 1: the OWASP Password Storage Cheat Sheet's first
 * recommended argon2id setting (from memory).
 */
const argon2idOptions = {
  algorithm: 2, // Algorithm.Argon2id (a const enum in the typings)
  memoryCost: 19_456,
  timeCost: 2,
  parallelism: 1,
} as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, argon2idOptions);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/** Spends the same time as a real check, so an unknown e-mail cannot be told apart by timing. */
export async function verifyAgainstNothing(password: string): Promise<false> {
  dummyHash ??= hashPassword('millrace-timing-equaliser');
  await verifyPassword(await dummyHash, password);
  return false;
}
