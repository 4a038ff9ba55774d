import { z } from "zod";
import { ROLES } from "@/lib/auth/permissions";
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from "@/lib/auth/passwords";
import { emailField } from "@/lib/services/fields";

export const RoleField = z.enum(ROLES, { error: "Choose a role: admin, engineer, inspector or owner." });

export const PasswordField = z
  .string({ error: "Password is required." })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(PASSWORD_MAX_LENGTH, `At most ${PASSWORD_MAX_LENGTH} characters.`);

export const InviteMemberInput = z.object({ email: emailField, role: RoleField });
export type InviteMemberInput = z.infer<typeof InviteMemberInput>;

export const AcceptInvitationInput = z.object({
  token: z.string().min(1, "The invitation link is incomplete."),
  displayName: z.string({ error: "Name is required." }).trim().min(1, "Name is required.").max(120, "At most 120 characters."),
  password: PasswordField,
});
export type AcceptInvitationInput = z.infer<typeof AcceptInvitationInput>;

export const ChangeMemberRoleInput = z.object({ userId: z.uuid("No such member."), role: RoleField });
export type ChangeMemberRoleInput = z.infer<typeof ChangeMemberRoleInput>;

export const RemoveMemberInput = z.object({ userId: z.uuid("No such member.") });
export type RemoveMemberInput = z.infer<typeof RemoveMemberInput>;

export const RevokeInvitationInput = z.object({ id: z.uuid("No such invitation.") });
export type RevokeInvitationInput = z.infer<typeof RevokeInvitationInput>;

export const RequestPasswordResetInput = z.object({ email: emailField });
export type RequestPasswordResetInput = z.infer<typeof RequestPasswordResetInput>;

export const ResetPasswordInput = z.object({
  token: z.string().min(1, "The reset link is incomplete."),
  password: PasswordField,
});
export type ResetPasswordInput = z.infer<typeof ResetPasswordInput>;

export const ListAuditInput = z.object({
  limit: z.coerce.number().int().min(1).max(200).optional(),
  before: z.uuid().optional(),
});
export type ListAuditInput = z.infer<typeof ListAuditInput>;
