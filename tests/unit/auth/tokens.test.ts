import { describe, expect, it } from "vitest";
import { GATEWAY_KEY_PREFIX, PERSONAL_TOKEN_PREFIX, bearerFrom, generateSecret, hashSecret } from "@/lib/auth/tokens";

describe("hashSecret", () => {
  it("is SHA-256 in hex (FIPS 180-2 Appendix B.1 test vector 'abc')", () => {
    expect(hashSecret("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("hashes the empty string to the published SHA-256 of no input (FIPS 180-2 / NIST CAVS)", () => {
    expect(hashSecret("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });
});

describe("generateSecret", () => {
  it("prefixes personal tokens and gateway keys and keeps 32 random bytes (43 base64url chars)", () => {
    for (const prefix of [PERSONAL_TOKEN_PREFIX, GATEWAY_KEY_PREFIX]) {
      const s = generateSecret(prefix);
      expect(s.token.startsWith(prefix)).toBe(true);
      // RFC 4648 §5: 32 bytes → ceil(32·8/6) = 43 characters without padding
      expect(s.token.slice(prefix.length)).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(s.hash).toBe(hashSecret(s.token));
      expect(s.displayPrefix).toBe(s.token.slice(0, prefix.length + 6));
    }
  });

  it("never repeats a secret and never stores the secret itself in the hash", () => {
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const s = generateSecret(PERSONAL_TOKEN_PREFIX);
      expect(seen.has(s.token)).toBe(false);
      seen.add(s.token);
      expect(s.hash.includes(s.token.slice(PERSONAL_TOKEN_PREFIX.length))).toBe(false);
    }
  });
});

describe("bearerFrom", () => {
  it("reads the credentials of an RFC 6750 §2.1 Authorization header", () => {
    expect(bearerFrom("Bearer mw_pat_abc")).toBe("mw_pat_abc");
    expect(bearerFrom("bearer   mw_gw_xyz ")).toBe("mw_gw_xyz");
  });

  it("answers null for other schemes and empty headers", () => {
    expect(bearerFrom(null)).toBeNull();
    expect(bearerFrom("")).toBeNull();
    expect(bearerFrom("Basic dXNlcjpwYXNz")).toBeNull();
    expect(bearerFrom("Bearer")).toBeNull();
  });
});
