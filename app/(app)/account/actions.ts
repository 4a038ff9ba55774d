"use server";

import { revalidatePath } from "next/cache";
import { defineAction } from "@/lib/http/define-action";
import { ChangePasswordInput, CreateApiTokenInput, RevokeApiTokenInput, UpdateProfileInput } from "@/lib/services/accounts/schemas";
import { createApiToken, revokeApiToken } from "@/lib/services/accounts/api-token.service";
import { changePassword, updateProfile } from "@/lib/services/accounts/profile.service";
import { UpdateNotificationPrefsInput, updateNotificationPrefs } from "@/lib/services/accounts/notification.service";

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

export const updateNotificationPrefsAction = defineAction(UpdateNotificationPrefsInput, async (input, actor) => {
  const prefs = await updateNotificationPrefs(actor, input);
  revalidatePath("/account");
  return { muted: prefs.filter((p) => p.muted).map((p) => p.assetId) };
});
