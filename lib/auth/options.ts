/**
 * next-auth (v4) configuration: e-mail + password (Credentials) and a JWT session carrying
 * the user id, the current organisation and the role there. `update({ organisationId })`
 * from the client switches organisation (checked against the user's memberships).
 * Services never trust the token's role: the session helpers re-read the membership.
 */
import type { NextAuthOptions, Session } from "next-auth";
import type { JWT } from "next-auth/jwt";
import CredentialsProvider from "next-auth/providers/credentials";
import { env } from "@/lib/config/env";
import { isRole } from "@/lib/auth/permissions";
import { isAppError } from "@/lib/http/errors";
import { SignInInput } from "@/lib/services/accounts/schemas";
import { switchOrganisation, verifyCredentials } from "@/lib/services/accounts/account.service";

/** Eight hours: a working day; the token is refreshed while the user is active. */
const SESSION_MAX_AGE_S = 8 * 60 * 60;

export function secureCookies(): boolean {
  return env().APP_URL.startsWith("https://");
}

/** The session cookie's name (proxy.ts and defineRoute read the same cookie). */
export function sessionCookieName(): string {
  return `${secureCookies() ? "__Secure-" : ""}next-auth.session-token`;
}

/** The client address of a sign-in request (first X-Forwarded-For hop, set by Next's server). */
function clientAddress(headers: Record<string, unknown> | undefined): string {
  const fwd = headers?.["x-forwarded-for"];
  const first = typeof fwd === "string" ? fwd.split(",")[0]?.trim() : undefined;
  const real = headers?.["x-real-ip"];
  return first || (typeof real === "string" ? real : "") || "unknown";
}

interface ModewardenClaims {
  userId?: string;
  organisationId?: string;
  role?: string;
}

export function authOptions(): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    useSecureCookies: secureCookies(),
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "E-mail and password",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        async authorize(credentials, req) {
          const parsed = SignInInput.safeParse(credentials ?? {});
          if (!parsed.success) throw new Error("unauthorized: E-mail or password is incorrect.");
          try {
            const user = await verifyCredentials({ ...parsed.data, ip: clientAddress(req?.headers) });
            const first = user.memberships[0];
            return {
              id: user.userId, email: user.email, name: user.displayName,
              organisationId: first.organisationId, role: first.role,
            };
          } catch (e) {
            // next-auth passes the message to the client as `error`; keep the code in front.
            if (isAppError(e)) throw new Error(`${e.code}: ${e.message}`);
            throw e;
          }
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user, trigger, session }) {
        const claims = token as JWT & ModewardenClaims;
        if (user) {
          const u = user as typeof user & { organisationId?: string; role?: string };
          claims.userId = u.id;
          claims.organisationId = u.organisationId;
          claims.role = u.role;
        }
        const wanted = (session as { organisationId?: unknown } | undefined)?.organisationId;
        if (trigger === "update" && typeof wanted === "string" && claims.userId) {
          try {
            const m = await switchOrganisation(claims.userId, wanted);
            claims.organisationId = m.organisationId;
            claims.role = m.role;
          } catch {
            // Not a member there: keep the current organisation.
          }
        }
        return claims;
      },
      async session({ session, token }) {
        const claims = token as JWT & ModewardenClaims;
        const s = session as Session & ModewardenClaims;
        s.userId = claims.userId;
        s.organisationId = claims.organisationId;
        s.role = isRole(claims.role) ? claims.role : undefined;
        return s;
      },
    },
  };
}
