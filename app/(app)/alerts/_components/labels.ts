/** Words shown for alert states, outcomes and timeline events (PRODUCT.md names). */
export const STATE_LABELS: Record<string, string> = {
  open: "Open",
  acknowledged: "Acknowledged",
  inspection_scheduled: "Inspection scheduled",
  closed: "Closed",
};

export const OUTCOME_LABELS: Record<string, string> = {
  no_defect_found: "No defect found",
  environmental_cause: "Environmental cause",
  sensor_fault: "Sensor fault",
  defect_found: "Defect found",
  repaired: "Repaired",
};

export const EVENT_LABELS: Record<string, string> = {
  raised: "Alert raised",
  acknowledged: "Acknowledged",
  inspection_scheduled: "Inspection scheduled",
  assigned: "Assigned",
  comment: "Comment",
  closed: "Closed",
  attachment: "File attached",
};

const STATE_TONES: Record<string, string> = {
  open: "border-red-700/40 bg-red-50 text-red-800",
  acknowledged: "border-amber-600/40 bg-amber-50 text-amber-900",
  inspection_scheduled: "border-sky-700/40 bg-sky-50 text-sky-900",
  closed: "border-line-strong bg-sunken text-muted",
};

export function stateTone(state: string): string {
  return STATE_TONES[state] ?? STATE_TONES.closed;
}
