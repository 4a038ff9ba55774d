import { z } from "zod";
import { emailField } from "@/lib/services/fields";

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
