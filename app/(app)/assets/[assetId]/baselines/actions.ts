"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { zonedDayStart } from "@/components/records/zoned-day";
import { defineAction } from "@/lib/http/define-action";
import { AppError } from "@/lib/http/errors";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { fitAndActivateBaseline } from "@/lib/services/drift/baseline.service";

const FitForm = z.object({
  assetId: z.uuid("No such asset."),
  from: z.string().trim().min(1, "Choose the first day of the training window."),
  to: z.string().trim().min(1, "Choose the last day of the training window."),
  model: z.enum(["auto", "linear", "bilinear"], { error: "Choose auto, linear or bilinear." }).default("auto"),
});

/**
 * Fit a baseline on the organisation days [from, to] (both included) and activate it; the
 * service audits it and queues the drift replay.
 */
export const fitBaselineAction = defineAction(FitForm, async ({ assetId, from, to, model }, actor) => {
  const tz = (await getOrganisation(actor)).timeZone;
  const start = zonedDayStart(from, tz);
  const end = zonedDayStart(to, tz, 1);
  const fieldErrors: Record<string, string[]> = {};
  if (!start) fieldErrors.from = ["Use a day such as 2025-01-01."];
  if (!end) fieldErrors.to = ["Use a day such as 2025-09-30."];
  if (start && end && start >= end) fieldErrors.to = ["The last day must not be before the first."];
  if (!start || !end || Object.keys(fieldErrors).length > 0) {
    throw new AppError("unprocessable", "Please correct the highlighted fields.", { fieldErrors });
  }
  const b = await fitAndActivateBaseline(actor, assetId, { from: start, to: end, model });
  revalidatePath(`/assets/${assetId}`, "layout");
  return { version: b.version, status: b.status, modes: b.models.map((m) => `${m.label} (${m.model.kind})`) };
});
