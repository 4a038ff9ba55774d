"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { AppError } from "@/lib/http/errors";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import {
  acknowledgeAlert, assignAlert, closeAlert, commentOnAlert, scheduleInspection,
} from "@/lib/services/alerts/alert.service";
import { addAlertAttachment } from "@/lib/services/alerts/attachment.service";
import { AssignAlertInput, CloseAlertInput, CommentAlertInput } from "@/lib/services/alerts/schemas";
import { zonedDayStart } from "@/components/records/zoned-day";

const Target = z.object({ alertId: z.uuid("No such alert.") });
const refresh = (alertId: string) => {
  revalidatePath(`/alerts/${alertId}`);
  revalidatePath("/alerts");
};

export const acknowledgeAlertAction = defineAction(Target, async ({ alertId }, actor) => {
  const alert = await acknowledgeAlert(actor, alertId);
  refresh(alertId);
  return { state: alert.state };
});

/** The inspection day is a day of the organisation's calendar (its time zone). */
const ScheduleForm = Target.extend({
  day: z.string({ error: "Inspection date is required." }).regex(/^\d{4}-\d{2}-\d{2}$/, "Inspection date is required."),
  note: z.string().trim().max(2000, "At most 2000 characters.").optional(),
});

export const scheduleInspectionAction = defineAction(ScheduleForm, async ({ alertId, day, note }, actor) => {
  const { timeZone } = await getOrganisation(actor);
  const at = zonedDayStart(day, timeZone);
  if (!at) throw new AppError("unprocessable", "Inspection date is required.", { fieldErrors: { day: ["Inspection date is required."] } });
  const alert = await scheduleInspection(actor, alertId, { at, note: note || undefined });
  refresh(alertId);
  return { state: alert.state };
});

export const assignAlertAction = defineAction(Target.extend(AssignAlertInput.shape), async ({ alertId, userId }, actor) => {
  await assignAlert(actor, alertId, { userId });
  refresh(alertId);
  return { userId };
});

export const commentAlertAction = defineAction(Target.extend(CommentAlertInput.shape), async ({ alertId, text }, actor) => {
  await commentOnAlert(actor, alertId, { text });
  refresh(alertId);
  return { commented: true };
});

export const closeAlertAction = defineAction(Target.extend(CloseAlertInput.shape), async ({ alertId, outcome, findings }, actor) => {
  const alert = await closeAlert(actor, alertId, { outcome, findings });
  refresh(alertId);
  return { state: alert.state };
});

const AttachForm = Target.extend({
  file: z.custom<File>((v) => v instanceof File && v.size > 0, "Choose a photo or a PDF to attach."),
});

export const attachFileAction = defineAction(AttachForm, async ({ alertId, file }, actor) => {
  const attachment = await addAlertAttachment(actor, alertId, {
    filename: file.name, declaredType: file.type || null, bytes: new Uint8Array(await file.arrayBuffer()),
  });
  refresh(alertId);
  return { id: attachment.id, filename: attachment.filename };
});
