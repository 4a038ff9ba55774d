"use server";

import { z } from "zod";
import { definePublicAction } from "@/lib/http/define-action";
import { AcceptInvitationInput, RequestPasswordResetInput, ResetPasswordInput } from "@/lib/services/team/schemas";
import { acceptInvitation, requestPasswordReset, resetPassword } from "@/lib/services/team/team.service";

const confirmPassword = z.string({ error: "Repeat the password." });
const samePassword = (v: { password: string; confirmPassword: string }) => v.password === v.confirmPassword;
const differ = { path: ["confirmPassword"], message: "The two passwords differ." };

/** Both password fields must agree before the service sees the password. */
const AcceptInvitationForm = AcceptInvitationInput.extend({ confirmPassword }).refine(samePassword, differ);
const ResetPasswordForm = ResetPasswordInput.extend({ confirmPassword }).refine(samePassword, differ);

export const acceptInvitationAction = definePublicAction(AcceptInvitationForm, async ({ token, displayName, password }) => {
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

export const resetPasswordAction = definePublicAction(ResetPasswordForm, async ({ token, password }) => {
  const { email } = await resetPassword({ token, password });
  return { email };
});
