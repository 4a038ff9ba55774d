"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { zonedDayStart } from "@/components/records/zoned-day";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { defineAction } from "@/lib/http/define-action";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { planReprocessRange, reprocessRange } from "@/lib/services/analysis/reprocess.service";
import { UpdateAnalysisSettingsInput } from "@/lib/services/analysis/schemas";
import { updateAnalysisSettings } from "@/lib/services/analysis/settings.service";
import { booleanField } from "@/lib/services/fields";
import { CreateTrackedModeInput, UpdateTrackedModeInput } from "@/lib/services/tracking/schemas";
import { createTrackedMode, deleteTrackedMode, updateTrackedMode } from "@/lib/services/tracking/tracked-mode.service";

const AssetRef = z.object({ assetId: z.uuid("Unknown asset.") });
const ModeRef = AssetRef.extend({ trackedModeId: z.uuid("Unknown tracked mode.") });

const refresh = (assetId: string) => revalidatePath(`/assets/${assetId}`, "layout");

/** Save the analysis settings as the asset's next version (engineers, admins). */
export const saveSettingsAction = defineAction(
  z.intersection(AssetRef, UpdateAnalysisSettingsInput),
  async ({ assetId, ...input }, actor) => {
    const saved = await updateAnalysisSettings(actor, assetId, input);
    refresh(assetId);
    return { version: saved.version };
  },
);

/** A tracked mode from a design or FE frequency entered by hand (band defaults to ±5 %). */
export const addTrackedModeAction = defineAction(
  z.intersection(AssetRef, CreateTrackedModeInput),
  async ({ assetId, label, nominalFrequencyHz, bandLowHz, bandHighHz }, actor) => {
    const mode = await createTrackedMode(actor, assetId, { label, nominalFrequencyHz, bandLowHz, bandHighHz });
    refresh(assetId);
    return { id: mode.id, label: mode.label };
  },
);

/** Edit a tracked mode's label and search band. */
export const editTrackedModeAction = defineAction(
  z.intersection(ModeRef, UpdateTrackedModeInput),
  async ({ assetId, trackedModeId, label, bandLowHz, bandHighHz }, actor) => {
    const mode = await updateTrackedMode(actor, assetId, trackedModeId, { label, bandLowHz, bandHighHz });
    refresh(assetId);
    return { id: mode.id, label: mode.label };
  },
);

/** Deactivate a tracked mode (its history stays) or make it active again. */
export const setTrackedModeActiveAction = defineAction(
  ModeRef.extend({ active: booleanField }),
  async ({ assetId, trackedModeId, active }, actor) => {
    const mode = active
      ? await updateTrackedMode(actor, assetId, trackedModeId, { active: true })
      : await deleteTrackedMode(actor, assetId, trackedModeId);
    refresh(assetId);
    return { id: mode.id, active: mode.active };
  },
);

const day = (label: string) =>
  z.string({ error: `${label} is required.` }).trim().regex(/^\d{4}-\d{2}-\d{2}$/, `${label}: use a day such as 2026-03-01.`);
const DayRange = AssetRef.extend({ from: day("First day"), to: day("Last day") });

/** The organisation's days [from, to] (last day inclusive) as instants. */
async function instantsOf(actor: Actor, from: string, to: string): Promise<{ from: Date; to: Date }> {
  const tz = (await getOrganisation(actor)).timeZone;
  const start = zonedDayStart(from, tz);
  const end = zonedDayStart(to, tz, 1);
  if (!start) throw new AppError("unprocessable", "Invalid first day.", { fieldErrors: { from: ["Not a valid day."] } });
  if (!end) throw new AppError("unprocessable", "Invalid last day.", { fieldErrors: { to: ["Not a valid day."] } });
  if (start >= end) {
    throw new AppError("unprocessable", "The last day must not be before the first.", { fieldErrors: { to: ["The last day must not be before the first."] } });
  }
  return { from: start, to: end };
}

/** How many records a range reprocess would queue, and with which settings version (changes nothing). */
export const previewReprocessAction = defineAction(DayRange, async ({ assetId, from, to }, actor) => {
  const plan = await planReprocessRange(actor, assetId, await instantsOf(actor, from, to));
  return { from, to, ...plan };
});

/** Queue the records of the days [from, to] for analysis with the current settings version. */
export const reprocessRangeAction = defineAction(DayRange, async ({ assetId, from, to }, actor) => {
  const outcome = await reprocessRange(actor, assetId, await instantsOf(actor, from, to));
  refresh(assetId);
  return { from, to, ...outcome };
});
