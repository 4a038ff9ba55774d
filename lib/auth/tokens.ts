/**
 * Random secrets shown once (personal API tokens, gateway device keys, invitation and reset
 * links) and their SHA-256 hashes, which are all that is stored. The secrets carry 256 bits
 * of entropy, so a plain (unsalted) SHA-256 lookup is safe: there is nothing to brute-force.
 */
import { createHash, randomBytes } from "node:crypto";

/** Personal API tokens: `Authorization: Bearer mw_pat_…`. */
export const PERSONAL_TOKEN_PREFIX = "mw_pat_";
/** Gateway device keys: `Authorization: Bearer mw_gw_…`. */
export const GATEWAY_KEY_PREFIX = "mw_gw_";

/** Characters of the random part kept in the display prefix (`mw_pat_ab12cd`). */
const DISPLAY_CHARS = 6;

export interface NewSecret {
  /** The full secret; give it to the user once and forget it. */
  token: string;
  /** Lower-case hex SHA-256 of `token`; store this. */
  hash: string;
  /** The type prefix plus the first characters, for lists ("mw_pat_ab12cd"). */
  displayPrefix: string;
}

/** Hex SHA-256 of a secret. */
export function hashSecret(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** A new 32-byte random secret (base64url, 43 characters) behind `prefix`. */
export function generateSecret(prefix = ""): NewSecret {
  const token = prefix + randomBytes(32).toString("base64url");
  return { token, hash: hashSecret(token), displayPrefix: token.slice(0, prefix.length + DISPLAY_CHARS) };
}

/** The secret of an `Authorization: Bearer <secret>` header, or null. */
export function bearerFrom(header: string | null | undefined): string | null {
  if (!header) return null;
  const m = /^Bearer\s+(\S+)\s*$/i.exec(header);
  return m ? m[1] : null;
}
