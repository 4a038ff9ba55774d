/**
 * Data builders for the integration tests. Every test file makes its own organisations and
 * users with unique e-mails, so files do not depend on each other or on truncation order.
 */
import { randomUUID } from "node:crypto";
import { encode } from "next-auth/jwt";
import { db } from "@/lib/db/knex";
import { insertOrganisation } from "@/lib/db/repos/organisation.repo";
import { insertUser } from "@/lib/db/repos/user.repo";
import { insertMembership } from "@/lib/db/repos/membership.repo";
import { hashPassword } from "@/lib/auth/passwords";
import { sessionCookieName } from "@/lib/auth/options";
import type { Role } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import type { Actor, Organisation } from "@/lib/domain/types";
import { createApiToken } from "@/lib/services/accounts/api-token.service";

export const PASSWORD = "correct-horse-battery-staple";
let passwordHash: Promise<string> | null = null;

export const unique = (label: string) => `${label}-${randomUUID().slice(0, 8)}`;

export async function makeOrg(name = unique("Test Org")): Promise<Organisation> {
  return insertOrganisation(db(), { name, timeZone: "America/Denver" });
}

export interface TestMember { userId: string; email: string; password: string; actor: Actor }

/** A user with PASSWORD and the role in `org` (another membership may be added later). */
export async function makeMember(org: Organisation, role: Role, email = `${unique(role)}@test.example`): Promise<TestMember> {
  passwordHash ??= hashPassword(PASSWORD);
  const user = await insertUser(db(), { email, passwordHash: await passwordHash, displayName: `Test ${role}` });
  await insertMembership(db(), { userId: user.id, organisationId: org.id, role });
  return { userId: user.id, email: user.email, password: PASSWORD, actor: { userId: user.id, organisationId: org.id, role, via: "session" } };
}

/** One member per role in a fresh organisation. */
export async function makeTeam(): Promise<{ org: Organisation } & Record<Role, TestMember>> {
  const org = await makeOrg();
  const [admin, engineer, inspector, owner] = await Promise.all(
    (["admin", "engineer", "inspector", "owner"] as const).map((r) => makeMember(org, r)),
  );
  return { org, admin, engineer, inspector, owner };
}

export async function tokenFor(m: TestMember): Promise<string> {
  return (await createApiToken(m.actor, { name: unique("test token") })).token;
}

/** A next-auth session cookie for the member, as the sign-in would have set it. */
export async function sessionCookieFor(m: TestMember): Promise<string> {
  const jwt = await encode({
    token: { sub: m.userId, userId: m.userId, organisationId: m.actor.organisationId, role: m.actor.role },
    secret: env().NEXTAUTH_SECRET,
  });
  return `${sessionCookieName()}=${jwt}`;
}

type Handler = (req: Request, ctx?: { params: Promise<Record<string, string | string[] | undefined>> }) => Promise<Response>;

/** Call a route handler as Next would. */
export async function call(
  handler: Handler,
  opts: { method?: string; path?: string; params?: Record<string, string>; token?: string; cookie?: string; body?: unknown; rawBody?: string; contentType?: string } = {},
): Promise<{ status: number; body: Record<string, unknown> }> {
  const headers: Record<string, string> = {};
  if (opts.token) headers.authorization = `Bearer ${opts.token}`;
  if (opts.cookie) headers.cookie = opts.cookie;
  let payload: string | undefined;
  if (opts.body !== undefined || opts.rawBody !== undefined) {
    payload = opts.rawBody ?? JSON.stringify(opts.body);
    headers["content-type"] = opts.contentType ?? "application/json";
  }
  const req = new Request(`http://127.0.0.1/api/v1${opts.path ?? "/test"}`, { method: opts.method ?? "GET", headers, body: payload });
  const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
  const text = await res.text();
  return { status: res.status, body: text ? (JSON.parse(text) as Record<string, unknown>) : {} };
}

export const validAsset = (name = unique("Asset")) => ({
  name, kind: "footbridge" as const, latitude: 39.2, longitude: -104.1, material: "Steel", mainDimensionM: 30, expectedIntervalMin: 30,
});
