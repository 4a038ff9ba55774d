/**
 * Reading the next-auth session cookie without next-auth's request machinery, so that route
 * handlers (any `Request`) and server components (`cookies()`) share one path. The token is
 * decoded with the app secret, then the membership is re-read: the role is the current one.
 */
import { decode } from "next-auth/jwt";
import { env } from "@/lib/config/env";
import type { Actor } from "@/lib/domain/types";
import { resolveActor } from "@/lib/services/accounts/account.service";
import { sessionCookieName } from "./options";

export interface CookieLike {
  name: string;
  value: string;
}

/** Cookies of a `Cookie:` header. */
export function parseCookieHeader(header: string | null): CookieLike[] {
  if (!header) return [];
  return header.split(";").flatMap((part) => {
    const i = part.indexOf("=");
    if (i < 0) return [];
    const name = part.slice(0, i).trim();
    const raw = part.slice(i + 1).trim();
    let value = raw;
    try {
      value = decodeURIComponent(raw);
    } catch {
      // keep the raw value
    }
    return name ? [{ name, value }] : [];
  });
}

/** The session JWT from the cookies, joining next-auth's chunks (`name.0`, `name.1`, …). */
export function sessionTokenFrom(cookies: CookieLike[]): string | null {
  const base = sessionCookieName();
  const parts = cookies.filter((c) => c.name === base || c.name.startsWith(`${base}.`));
  if (parts.length === 0) return null;
  const suffix = (n: string) => (n === base ? 0 : Number.parseInt(n.slice(base.length + 1), 10) || 0);
  return parts.sort((a, b) => suffix(a.name) - suffix(b.name)).map((c) => c.value).join("");
}

/** The actor of a session cookie, or null (no cookie, bad or expired token, no longer a member). */
export async function actorFromSessionCookies(cookies: CookieLike[]): Promise<Actor | null> {
  const token = sessionTokenFrom(cookies);
  if (!token) return null;
  let claims: Record<string, unknown> | null = null;
  try {
    claims = await decode({ token, secret: env().NEXTAUTH_SECRET });
  } catch {
    return null;
  }
  const userId = claims?.userId;
  const organisationId = claims?.organisationId;
  if (typeof userId !== "string" || typeof organisationId !== "string") return null;
  return resolveActor(userId, organisationId, "session");
}
