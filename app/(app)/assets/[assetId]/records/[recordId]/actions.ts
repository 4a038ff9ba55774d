"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { reprocessRecord, retryFailedRecord } from "@/lib/services/analysis/reprocess.service";
import { createTrackedMode } from "@/lib/services/tracking/tracked-mode.service";
import { CreateTrackedModeInput } from "@/lib/services/tracking/schemas";

const RecordRef = z.object({ assetId: z.uuid("Unknown asset."), recordId: z.uuid("Unknown record.") });

/** "Track this mode": a new tracked mode from an identified mode of this record (engineers). */
export const trackModeAction = defineAction(
  z.intersection(z.object({ assetId: z.uuid("Unknown asset.") }), CreateTrackedModeInput),
  async ({ assetId, ...input }, actor) => {
    const mode = await createTrackedMode(actor, assetId, input);
    revalidatePath(`/assets/${assetId}/records`, "layout");
    return { id: mode.id, label: mode.label };
  },
);

/** Queue the record for analysis again with the asset's current settings (engineers). */
export const reprocessAction = defineAction(RecordRef, async ({ assetId, recordId }, actor) => {
  await reprocessRecord(actor, assetId, recordId);
  revalidatePath(`/assets/${assetId}/records`, "layout");
  return { recordId };
});

/** Queue a failed record again (engineers). */
export const retryAction = defineAction(RecordRef, async ({ assetId, recordId }, actor) => {
  await retryFailedRecord(actor, assetId, recordId);
  revalidatePath(`/assets/${assetId}/records`, "layout");
  return { recordId };
});
