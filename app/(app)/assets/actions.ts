"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { CreateAssetInput, UpdateAssetInput } from "@/lib/services/assets/schemas";
import { createAsset, updateAsset } from "@/lib/services/assets/asset.service";

export const createAssetAction = defineAction(CreateAssetInput, async (input, actor) => {
  const asset = await createAsset(actor, input);
  revalidatePath("/");
  return { id: asset.id };
});

export const updateAssetAction = defineAction(UpdateAssetInput.extend({ assetId: z.uuid("No such asset.") }), async ({ assetId, ...input }, actor) => {
  const asset = await updateAsset(actor, assetId, input);
  revalidatePath(`/assets/${asset.id}`, "layout");
  return { id: asset.id };
});
