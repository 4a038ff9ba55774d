/** Input schemas of the alert lifecycle (PRODUCT.md states and outcomes). */
import { z } from "zod";
import { ALERT_OUTCOMES, ALERT_STATES } from "@/lib/domain/drift";

const emptyToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);

export const ListAlertsQuery = z.object({
  assetId: z.preprocess(emptyToUndefined, z.uuid("Unknown asset.").optional()),
  state: z.preprocess(emptyToUndefined, z.enum(ALERT_STATES).optional()),
  assigneeUserId: z.preprocess(emptyToUndefined, z.uuid("Unknown user.").optional()),
  limit: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(500).default(100)),
});
export type ListAlertsQuery = z.input<typeof ListAlertsQuery>;

export const ScheduleInspectionInput = z.object({
  at: z.coerce.date({ error: "Inspection date is required." }).refine((d) => !Number.isNaN(d.getTime()), "Inspection date is required."),
  note: z.string().trim().max(2000, "At most 2000 characters.").optional(),
});
export type ScheduleInspectionInput = z.infer<typeof ScheduleInspectionInput>;

export const AssignAlertInput = z.object({ userId: z.uuid("Choose an inspector.") });
export type AssignAlertInput = z.infer<typeof AssignAlertInput>;

export const CommentAlertInput = z.object({
  text: z.string({ error: "Comment is required." }).trim().min(1, "Comment is required.").max(4000, "At most 4000 characters."),
});
export type CommentAlertInput = z.infer<typeof CommentAlertInput>;

export const CloseAlertInput = z.object({
  outcome: z.enum(ALERT_OUTCOMES, { error: "Choose an outcome." }),
  findings: z.string({ error: "Findings are required." }).trim().min(1, "Findings are required.").max(10000, "At most 10000 characters."),
});
export type CloseAlertInput = z.infer<typeof CloseAlertInput>;
