"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { ChannelInput, CreateGatewayInput, UpdateChannelInput } from "@/lib/services/assets/schemas";
import { addChannel, deactivateChannel, updateChannel } from "@/lib/services/assets/asset.service";
import { createGateway, revokeGateway } from "@/lib/services/assets/gateway.service";

const assetId = z.uuid("No such asset.");

/** The channel row posts flat x, y, z inputs; the service schema wants `positionM: { x, y, z }`. */
function nestPosition(v: unknown): unknown {
  if (typeof v !== "object" || v === null) return v;
  const { x, y, z: zz, ...rest } = v as Record<string, unknown>;
  return { ...rest, positionM: { x, y, z: zz } };
}

export const addChannelAction = defineAction(
  z.preprocess(nestPosition, ChannelInput.extend({ assetId })),
  async ({ assetId: id, ...input }, actor) => {
    const channel = await addChannel(actor, id, input);
    revalidatePath(`/assets/${id}`, "layout");
    return { id: channel.id };
  },
);

export const updateChannelAction = defineAction(
  z.preprocess(nestPosition, UpdateChannelInput.extend({ assetId, channelId: z.uuid("No such channel.") })),
  async ({ assetId: id, channelId, ...input }, actor) => {
    const channel = await updateChannel(actor, id, channelId, input);
    revalidatePath(`/assets/${id}`, "layout");
    return { id: channel.id };
  },
);

export const deactivateChannelAction = defineAction(
  z.object({ assetId, channelId: z.uuid("No such channel.") }),
  async ({ assetId: id, channelId }, actor) => {
    await deactivateChannel(actor, id, channelId);
    revalidatePath(`/assets/${id}`, "layout");
    return { id: channelId };
  },
);

export const createGatewayAction = defineAction(CreateGatewayInput.extend({ assetId }), async ({ assetId: id, ...input }, actor) => {
  const { gateway, key } = await createGateway(actor, id, input);
  revalidatePath(`/assets/${id}`, "layout");
  return { gateway: { id: gateway.id, name: gateway.name, keyPrefix: gateway.keyPrefix }, key };
});

export const revokeGatewayAction = defineAction(
  z.object({ assetId, gatewayId: z.uuid("No such gateway.") }),
  async ({ assetId: id, gatewayId }, actor) => {
    await revokeGateway(actor, id, gatewayId);
    revalidatePath(`/assets/${id}`, "layout");
    return { id: gatewayId };
  },
);
