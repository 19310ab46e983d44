import "server-only";
import { hash, verify } from "@node-rs/argon2";

import { ARGON2_OPTIONS } from "./argon2-options";

export const MIN_PASSWORD_LENGTH = 12;

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

// Verifying against a real hash even for unknown accounts keeps the answer time the same,
// so timing does not tell which e-mail addresses exist.
let dummyHash: Promise<string> | null = null;
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hashPassword("not-a-real-password-for-timing");
  return dummyHash;
}
