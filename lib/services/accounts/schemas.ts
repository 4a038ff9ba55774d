import { z } from "zod";
import { emailField } from "@/lib/services/fields";
import { PasswordField } from "@/lib/services/team/schemas";

export const SignInInput = z.object({
  email: emailField,
  password: z.string({ error: "Password is required." }).min(1, "Password is required.").max(200),
});
export type SignInInput = z.infer<typeof SignInInput>;

export const CreateApiTokenInput = z.object({
  name: z.string({ error: "Name is required." }).trim().min(1, "Name is required.").max(80, "At most 80 characters."),
});
export type CreateApiTokenInput = z.infer<typeof CreateApiTokenInput>;

export const RevokeApiTokenInput = z.object({ id: z.uuid("No such token.") });
export type RevokeApiTokenInput = z.infer<typeof RevokeApiTokenInput>;

export const SwitchOrganisationInput = z.object({ organisationId: z.uuid("No such organisation.") });
export type SwitchOrganisationInput = z.infer<typeof SwitchOrganisationInput>;

export const UpdateProfileInput = z.object({
  displayName: z.string({ error: "Name is required." }).trim().min(1, "Name is required.").max(120, "At most 120 characters."),
});
export type UpdateProfileInput = z.infer<typeof UpdateProfileInput>;

export const ChangePasswordInput = z.object({
  currentPassword: z.string({ error: "Enter your current password." }).min(1, "Enter your current password."),
  newPassword: PasswordField,
  /** Optional here: the form may send it and the service checks it matches when present. */
  confirmPassword: z.string().optional(),
}).refine((v) => v.confirmPassword === undefined || v.confirmPassword === v.newPassword, {
  path: ["confirmPassword"], message: "The two passwords differ.",
});
export type ChangePasswordInput = z.infer<typeof ChangePasswordInput>;
