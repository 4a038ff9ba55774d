"use server";

import { revalidatePath } from "next/cache";
import { defineAction } from "@/lib/http/define-action";
import { ChangeMemberRoleInput, InviteMemberInput, RemoveMemberInput, RevokeInvitationInput } from "@/lib/services/team/schemas";
import { changeMemberRole, inviteMember, removeMember, revokeInvitation } from "@/lib/services/team/team.service";

export const inviteMemberAction = defineAction(InviteMemberInput, async (input, actor) => {
  const { invitation } = await inviteMember(actor, input);
  revalidatePath("/team");
  return { email: invitation.email, role: invitation.role };
});

export const changeMemberRoleAction = defineAction(ChangeMemberRoleInput, async (input, actor) => {
  await changeMemberRole(actor, input);
  revalidatePath("/team");
  return { userId: input.userId };
});

export const removeMemberAction = defineAction(RemoveMemberInput, async (input, actor) => {
  await removeMember(actor, input);
  revalidatePath("/team");
  return { userId: input.userId };
});

export const revokeInvitationAction = defineAction(RevokeInvitationInput, async (input, actor) => {
  await revokeInvitation(actor, input);
  revalidatePath("/team");
  return { id: input.id };
});
