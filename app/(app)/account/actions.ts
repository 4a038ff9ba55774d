"use server";

import { revalidatePath } from "next/cache";
import { defineAction } from "@/lib/http/define-action";
import { ChangePasswordInput, CreateApiTokenInput, RevokeApiTokenInput, UpdateProfileInput } from "@/lib/services/accounts/schemas";
import { createApiToken, revokeApiToken } from "@/lib/services/accounts/api-token.service";
import { changePassword, updateProfile } from "@/lib/services/accounts/profile.service";

export const updateProfileAction = defineAction(UpdateProfileInput, async (input, actor) => {
  await updateProfile(actor, input);
  revalidatePath("/", "layout");
  return { displayName: input.displayName };
});

export const changePasswordAction = defineAction(ChangePasswordInput, async (input, actor) => {
  await changePassword(actor, input);
  return { changed: true };
});

export const createApiTokenAction = defineAction(CreateApiTokenInput, async (input, actor) => {
  const { token, apiToken } = await createApiToken(actor, input);
  revalidatePath("/account");
  return { name: apiToken.name, token };
});

export const revokeApiTokenAction = defineAction(RevokeApiTokenInput, async (input, actor) => {
  await revokeApiToken(actor, input);
  revalidatePath("/account");
  return { id: input.id };
});
