"use server";

import { z } from "zod";
import { definePublicAction } from "@/lib/http/define-action";
import { AcceptInvitationInput, RequestPasswordResetInput, ResetPasswordInput } from "@/lib/services/team/schemas";
import { acceptInvitation, requestPasswordReset, resetPassword } from "@/lib/services/team/team.service";

/** Both password fields must agree before the service sees the password. */
function withConfirmation<S extends z.ZodObject<{ password: z.ZodType<string> }>>(schema: S) {
  return schema
    .extend({ confirmPassword: z.string({ error: "Repeat the password." }) })
    .refine((v) => v.password === v.confirmPassword, { path: ["confirmPassword"], message: "The two passwords differ." });
}

export const acceptInvitationAction = definePublicAction(withConfirmation(AcceptInvitationInput), async ({ token, displayName, password }) => {
  const { email } = await acceptInvitation({ token, displayName, password });
  return { email };
});

/** An invitation to an e-mail that already has an account: its current password confirms it. */
export const acceptInvitationExistingAction = definePublicAction(AcceptInvitationInput, async (input) => {
  const { email } = await acceptInvitation(input);
  return { email };
});

export const requestPasswordResetAction = definePublicAction(RequestPasswordResetInput, async (input) => {
  await requestPasswordReset(input);
  return { sent: true };
});

export const resetPasswordAction = definePublicAction(withConfirmation(ResetPasswordInput), async ({ token, password }) => {
  const { email } = await resetPassword({ token, password });
  return { email };
});
