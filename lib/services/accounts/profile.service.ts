/** The signed-in user's own profile, password and current organisation. */
import { db } from "@/lib/db/knex";
import { listMembershipsForUser } from "@/lib/db/repos/membership.repo";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import { findUserById, updateUserDisplayName, updateUserPassword } from "@/lib/db/repos/user.repo";
import { hashPassword, verifyPassword } from "@/lib/auth/passwords";
import type { Actor, Organisation } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import type { ChangePasswordInput, UpdateProfileInput } from "./schemas";

export interface Profile {
  userId: string;
  email: string;
  displayName: string;
}

export async function getProfile(actor: Actor): Promise<Profile> {
  const user = await findUserById(db(), actor.userId);
  if (!user) throw new AppError("unauthorized", "Sign in again.");
  return { userId: user.id, email: user.email, displayName: user.displayName };
}

/** The actor's current organisation (name, time zone for displaying times). */
export async function getOrganisation(actor: Actor): Promise<Organisation> {
  const org = await findOrganisationById(db(), actor.organisationId);
  if (!org) throw new AppError("not_found", "No such organisation.");
  return org;
}

export async function updateProfile(actor: Actor, input: UpdateProfileInput): Promise<Profile> {
  await db().transaction(async (trx) => {
    await updateUserDisplayName(trx, actor.userId, input.displayName);
    await recordAudit(trx, actor, {
      action: "user.profile_update", subjectType: "user", subjectId: actor.userId, details: { displayName: input.displayName },
    });
  });
  return getProfile(actor);
}

/** Change one's own password after checking the current one (field error otherwise). */
export async function changePassword(actor: Actor, input: ChangePasswordInput): Promise<void> {
  const user = await findUserById(db(), actor.userId);
  if (!user) throw new AppError("unauthorized", "Sign in again.");
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    throw new AppError("unprocessable", "The current password is not right.", {
      fieldErrors: { currentPassword: ["The current password is not right."] },
    });
  }
  const passwordHash = await hashPassword(input.newPassword);
  await db().transaction(async (trx) => {
    await updateUserPassword(trx, user.id, passwordHash);
    for (const m of await listMembershipsForUser(trx, user.id)) {
      await recordAudit(trx, { organisationId: m.organisationId, userId: user.id }, {
        action: "user.password_change", subjectType: "user", subjectId: user.id,
      });
    }
  });
}
