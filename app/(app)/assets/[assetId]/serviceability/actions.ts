"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { setServiceabilityOverride } from "@/lib/services/serviceability/overrides.service";
import { AssetServiceabilityInput, SetOverrideInput } from "@/lib/services/serviceability/schemas";
import { updateAssetServiceabilitySettings } from "@/lib/services/serviceability/serviceability.service";

/** Set or remove one organisation override of a serviceability value (engineers, admins). */
export const setOverrideAction = defineAction(SetOverrideInput.extend({ assetId: z.uuid("No such asset.") }), async ({ assetId, ...input }, actor) => {
  await setServiceabilityOverride(actor, input);
  revalidatePath(`/assets/${assetId}/serviceability`);
  return { key: input.key };
});

/** Section width and damping guidance row of the asset (engineers, admins). */
export const updateAssetServiceabilityAction = defineAction(
  AssetServiceabilityInput.extend({ assetId: z.uuid("No such asset.") }),
  async ({ assetId, ...input }, actor) => {
    await updateAssetServiceabilitySettings(actor, assetId, input);
    revalidatePath(`/assets/${assetId}/serviceability`);
    return { assetId };
  },
);
