/**
 * Signing in and who the actor is. Failed sign-ins are rate limited per e-mail and per
 * client address; the membership (and so the role) is looked up on every request, so a
 * role change or removal takes effect at once, whatever the session cookie still says.
 */
import { db } from "@/lib/db/knex";
import { findMembershipRole, listMembershipsForUser } from "@/lib/db/repos/membership.repo";
import { countRecentFailures, insertSignInAttempt } from "@/lib/db/repos/sign-in-attempt.repo";
import { findUserByEmail, findUserById, normaliseEmail } from "@/lib/db/repos/user.repo";
import { decoyPasswordHash, verifyPassword } from "@/lib/auth/passwords";
import type { Actor, Membership } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { isUuid } from "@/lib/services/authz";

/** Failed attempts allowed per e-mail / per address within the window before refusing. */
export const SIGN_IN_LIMITS = { windowMinutes: 15, perEmail: 5, perAddress: 20 } as const;

export interface VerifiedUser {
  userId: string;
  email: string;
  displayName: string;
  memberships: Membership[];
}

/**
 * Check an e-mail and password. Throws AppError('too_many_requests') when the e-mail or the
 * address had too many recent failures, AppError('unauthorized') for a wrong pair, a
 * disabled account or an account without organisation.
 */
export async function verifyCredentials(input: { email: string; password: string; ip: string }): Promise<VerifiedUser> {
  const email = normaliseEmail(input.email);
  const ip = input.ip || "unknown";
  const since = new Date(Date.now() - SIGN_IN_LIMITS.windowMinutes * 60_000);
  const failures = await countRecentFailures(db(), { email, ip }, since);
  if (failures.byEmail >= SIGN_IN_LIMITS.perEmail || failures.byIp >= SIGN_IN_LIMITS.perAddress) {
    throw new AppError(
      "too_many_requests",
      `Too many failed sign-ins. Wait ${SIGN_IN_LIMITS.windowMinutes} minutes, or reset your password.`,
    );
  }
  const user = await findUserByEmail(db(), email);
  const ok = await verifyPassword(user?.passwordHash ?? (await decoyPasswordHash()), input.password);
  const memberships = user && ok && !user.disabled ? await listMembershipsForUser(db(), user.id) : [];
  const succeeded = Boolean(user && ok && !user.disabled && memberships.length > 0);
  await insertSignInAttempt(db(), { email, ip, succeeded });
  if (!user || !succeeded) {
    if (user && ok && !user.disabled) {
      throw new AppError("unauthorized", "This account is not a member of any organisation.");
    }
    throw new AppError("unauthorized", "E-mail or password is incorrect.");
  }
  return { userId: user.id, email: user.email, displayName: user.displayName, memberships };
}

/** The organisations a user belongs to, with the role in each (organisation switcher). */
export async function listMemberships(userId: string): Promise<Membership[]> {
  if (!isUuid(userId)) return [];
  return listMembershipsForUser(db(), userId);
}

/**
 * The actor for a user acting in an organisation, with the role of the membership as it is
 * now; null when the user is disabled, gone, or no longer a member there.
 */
export async function resolveActor(
  userId: string, organisationId: string, via: Actor["via"],
): Promise<Actor | null> {
  if (!isUuid(userId) || !isUuid(organisationId)) return null;
  const [user, role] = await Promise.all([
    findUserById(db(), userId),
    findMembershipRole(db(), userId, organisationId),
  ]);
  if (!user || user.disabled || !role) return null;
  return { userId, organisationId, role, via };
}

/**
 * The organisation to switch a session to: the user's membership there, or not_found.
 * (next-auth's `update()` calls this before rewriting the token.)
 */
export async function switchOrganisation(userId: string, organisationId: string): Promise<Membership> {
  const m = (await listMemberships(userId)).find((x) => x.organisationId === organisationId);
  if (!m) throw new AppError("not_found", "No such organisation.");
  return m;
}
