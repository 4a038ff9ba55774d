/**
 * Password hashing with argon2id (@node-rs/argon2 defaults: m = 19 MiB, t = 2, p = 1, the
 * OWASP Password Storage Cheat Sheet's first argon2id configuration). Hashes are PHC strings.
 */
import { hash, verify } from "@node-rs/argon2";

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 200;

export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

/** True when `password` matches the PHC `passwordHash`; false for a malformed hash. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/**
 * A fixed hash to verify against when the e-mail is unknown, so that an unknown e-mail and
 * a wrong password take about the same time (no account enumeration by timing).
 */
let decoy: Promise<string> | null = null;
export function decoyPasswordHash(): Promise<string> {
  decoy ??= hash("modewarden-decoy-password-never-valid");
  return decoy;
}
