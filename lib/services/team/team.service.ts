/**
 * The Team: members, invitations, roles. Admins change things (`team:write`); every member
 * reads the list (`team:read`). Invitation e-mails go through the mail queue after commit.
 */
import { db } from "@/lib/db/knex";
import { enqueueMail } from "@/lib/jobs/queues";
import { env } from "@/lib/config/env";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import {
  deleteMembership, findMembershipRole, insertMembership, listMembersOfOrganisation, lockAdminIds, updateMembershipRole,
} from "@/lib/db/repos/membership.repo";
import {
  findInvitationByTokenHash, insertInvitation, listPendingInvitations, markInvitationAccepted, revokeInvitationById,
  revokePendingInvitations,
} from "@/lib/db/repos/invitation.repo";
import { findUserByEmail, findUserById, insertUser } from "@/lib/db/repos/user.repo";
import { hashPassword, verifyPassword } from "@/lib/auth/passwords";
import { generateSecret, hashSecret } from "@/lib/auth/tokens";
import type { Role } from "@/lib/auth/permissions";
import { invitationEmail } from "@/lib/email/templates/invitation";
import type { Actor, Invitation, Member } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan } from "@/lib/services/authz";
import type {
  AcceptInvitationInput, ChangeMemberRoleInput, InviteMemberInput, RemoveMemberInput, RevokeInvitationInput,
} from "./schemas";

export { listAudit } from "@/lib/services/audit/audit.service";
export { requestPasswordReset, resetPassword, checkPasswordResetToken } from "./password-reset.service";

export const INVITATION_VALID_DAYS = 7;

export async function listMembers(actor: Actor): Promise<Member[]> {
  assertCan(actor, "team:read");
  return listMembersOfOrganisation(db(), actor.organisationId);
}

/** Pending invitations of the organisation (admins). */
export async function listInvitations(actor: Actor): Promise<Invitation[]> {
  assertCan(actor, "team:write");
  return listPendingInvitations(db(), actor.organisationId);
}

/**
 * Invite someone by e-mail. A pending invitation to the same address is replaced; an
 * existing member answers conflict. The e-mail carries `${APP_URL}/invite/<token>`.
 */
export async function inviteMember(actor: Actor, input: InviteMemberInput): Promise<{ invitation: Invitation }> {
  assertCan(actor, "team:write");
  const secret = generateSecret();
  const expiresAt = new Date(Date.now() + INVITATION_VALID_DAYS * 86_400_000);
  const { invitation, organisationName, inviterName } = await db().transaction(async (trx) => {
    const existing = await findUserByEmail(trx, input.email);
    if (existing && (await findMembershipRole(trx, existing.id, actor.organisationId))) {
      throw new AppError("conflict", "This person is already a member.", {
        fieldErrors: { email: ["This person is already a member."] },
      });
    }
    await revokePendingInvitations(trx, actor.organisationId, input.email);
    const rec = await insertInvitation(trx, {
      organisationId: actor.organisationId, email: input.email, role: input.role, tokenHash: secret.hash,
      invitedByUserId: actor.userId, expiresAt,
    });
    await recordAudit(trx, actor, {
      action: "invitation.create", subjectType: "invitation", subjectId: rec.id, details: { email: rec.email, role: rec.role },
    });
    const [org, inviter] = await Promise.all([
      findOrganisationById(trx, actor.organisationId), findUserById(trx, actor.userId),
    ]);
    const { organisationId: _o, revokedAt: _r, ...invitation } = rec;
    return { invitation, organisationName: org?.name ?? "your organisation", inviterName: inviter?.displayName ?? "An administrator" };
  });
  const mail = invitationEmail({
    organisationName, inviterName, role: invitation.role, expiresAt,
    link: `${env().APP_URL.replace(/\/$/, "")}/invite/${secret.token}`,
  });
  await enqueueMail({ to: invitation.email, ...mail }, { jobId: `invitation-${invitation.id}` });
  return { invitation };
}

export async function revokeInvitation(actor: Actor, input: RevokeInvitationInput): Promise<void> {
  assertCan(actor, "team:write");
  await db().transaction(async (trx) => {
    const n = await revokeInvitationById(trx, actor.organisationId, input.id);
    if (n === 0) throw new AppError("not_found", "No such invitation.");
    await recordAudit(trx, actor, { action: "invitation.revoke", subjectType: "invitation", subjectId: input.id });
  });
}

export interface InvitationPreview {
  email: string;
  role: Role;
  organisationName: string;
  expiresAt: Date;
  /** The e-mail already has an account: accepting asks for its current password. */
  existingAccount: boolean;
}

/** What an invitation link is for; null when unknown, used, revoked or expired. */
export async function findInvitationByToken(token: string): Promise<InvitationPreview | null> {
  if (!token) return null;
  const rec = await findInvitationByTokenHash(db(), hashSecret(token));
  if (!rec || rec.acceptedAt || rec.revokedAt || rec.expiresAt.getTime() <= Date.now()) return null;
  const [org, user] = await Promise.all([findOrganisationById(db(), rec.organisationId), findUserByEmail(db(), rec.email)]);
  return {
    email: rec.email, role: rec.role, organisationName: org?.name ?? "", expiresAt: rec.expiresAt, existingAccount: Boolean(user),
  };
}

/**
 * Accept an invitation: create the account (or, for an existing account, check its
 * password) and the membership. Single use. Returns who can now sign in.
 */
export async function acceptInvitation(
  input: AcceptInvitationInput,
): Promise<{ userId: string; email: string; organisationId: string }> {
  const passwordHash = await hashPassword(input.password);
  return db().transaction(async (trx) => {
    const rec = await findInvitationByTokenHash(trx, hashSecret(input.token));
    if (!rec || rec.acceptedAt || rec.revokedAt || rec.expiresAt.getTime() <= Date.now()) {
      throw new AppError("not_found", "This invitation link is invalid, already used or expired. Ask for a new one.");
    }
    if (!(await markInvitationAccepted(trx, rec.id))) {
      throw new AppError("not_found", "This invitation link has already been used.");
    }
    let user = await findUserByEmail(trx, rec.email);
    if (user) {
      if (!(await verifyPassword(user.passwordHash, input.password))) {
        throw new AppError("unprocessable", "This e-mail already has an account: enter its current password.", {
          fieldErrors: { password: ["This e-mail already has an account: enter its current password."] },
        });
      }
    } else {
      user = await insertUser(trx, { email: rec.email, passwordHash, displayName: input.displayName });
    }
    await insertMembership(trx, { userId: user.id, organisationId: rec.organisationId, role: rec.role });
    await recordAudit(trx, { organisationId: rec.organisationId, userId: user.id }, {
      action: "invitation.accept", subjectType: "user", subjectId: user.id, details: { email: rec.email, role: rec.role },
    });
    return { userId: user.id, email: user.email, organisationId: rec.organisationId };
  });
}

/** Change a member's role; the last admin cannot be demoted (conflict). */
export async function changeMemberRole(actor: Actor, input: ChangeMemberRoleInput): Promise<Member> {
  assertCan(actor, "team:write");
  return db().transaction(async (trx) => {
    const admins = await lockAdminIds(trx, actor.organisationId);
    const current = await findMembershipRole(trx, input.userId, actor.organisationId);
    if (!current) throw new AppError("not_found", "No such member.");
    if (current === "admin" && input.role !== "admin" && admins.length <= 1) {
      throw new AppError("conflict", "The organisation needs at least one admin: make someone else admin first.", {
        fieldErrors: { role: ["The last admin cannot change role."] },
      });
    }
    if (current !== input.role) {
      await updateMembershipRole(trx, input.userId, actor.organisationId, input.role);
      await recordAudit(trx, actor, {
        action: "member.role_change", subjectType: "user", subjectId: input.userId, details: { from: current, to: input.role },
      });
    }
    const member = (await listMembersOfOrganisation(trx, actor.organisationId)).find((m) => m.userId === input.userId);
    if (!member) throw new AppError("not_found", "No such member.");
    return member;
  });
}

/** Remove a member from the organisation (the account stays); never the last admin. */
export async function removeMember(actor: Actor, input: RemoveMemberInput): Promise<void> {
  assertCan(actor, "team:write");
  await db().transaction(async (trx) => {
    const admins = await lockAdminIds(trx, actor.organisationId);
    const current = await findMembershipRole(trx, input.userId, actor.organisationId);
    if (!current) throw new AppError("not_found", "No such member.");
    if (current === "admin" && admins.length <= 1) {
      throw new AppError("conflict", "The organisation needs at least one admin: the last admin cannot be removed.");
    }
    await deleteMembership(trx, input.userId, actor.organisationId);
    await recordAudit(trx, actor, {
      action: "member.remove", subjectType: "user", subjectId: input.userId, details: { role: current },
    });
  });
}
