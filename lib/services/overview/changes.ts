/**
 * "What changed since <date>" (issue 6 §1): the rows of lib/db/repos/overview-changes.repo
 * turned into one dated list of plain sentences, newest first.
 */
import type {
  AlertChangeRow, AuditChangeRow, BaselineVersionRow, SettingsVersionRow,
} from "@/lib/db/repos/overview-changes.repo";

export const CHANGE_CATEGORIES = ["baseline", "settings", "channel", "mode", "gateway", "asset", "data", "alert"] as const;
export type ChangeCategory = (typeof CHANGE_CATEGORIES)[number];

export interface ChangeItem {
  /** ISO 8601. */
  at: string;
  category: ChangeCategory;
  text: string;
  by: string | null;
  href: string | null;
}

const day = (d: Date | string) => new Date(d).toISOString().slice(0, 10);
const str = (v: unknown) => (typeof v === "string" ? v : typeof v === "number" ? String(v) : null);
const list = (v: unknown) => (Array.isArray(v) ? v.filter((x): x is string => typeof x === "string") : []);

function auditText(r: AuditChangeRow): { category: ChangeCategory; text: string } {
  const d = r.details;
  const code = str(d.code) ?? "?";
  const label = str(d.label);
  const name = str(d.name);
  switch (r.action) {
    case "channel.create":
      return { category: "channel", text: `Sensor channel ${code} added.` };
    case "channel.update": {
      const fields = list(d.fields);
      return { category: "channel", text: fields.includes("active") ? `Sensor channel ${code} switched in or out of service (${fields.join(", ")}).` : `Sensor channel ${code} changed (${fields.join(", ") || "details"}).` };
    }
    case "tracked_mode.create":
      return { category: "mode", text: `Tracked mode ${label ? `“${label}” ` : ""}added.` };
    case "tracked_mode.update":
      return { category: "mode", text: `Tracked mode ${label ? `“${label}” ` : ""}changed.` };
    case "tracked_mode.deactivate":
      return { category: "mode", text: `Tracked mode ${label ? `“${label}” ` : ""}no longer tracked.` };
    case "gateway.create":
      return { category: "gateway", text: `Gateway ${name ? `“${name}” ` : ""}added.` };
    case "gateway.revoke":
      return { category: "gateway", text: `Gateway ${name ? `“${name}” ` : ""}key revoked.` };
    case "asset.update":
      return { category: "asset", text: `Asset description changed (${list(d.fields).join(", ") || "details"}).` };
    case "history.import":
      return { category: "data", text: `Modal history imported (${str(d.imported) ?? "?"} estimates${str(d.from) ? ` from ${day(String(d.from))} to ${day(String(d.to))}` : ""}).` };
    case "record.reprocess_range":
      return { category: "data", text: `${str(d.records) ?? "?"} records queued for reprocessing with settings version ${str(d.settingsVersion) ?? "?"}.` };
    default:
      return { category: "asset", text: r.action };
  }
}

const ALERT_WORDS: Record<string, string> = {
  raised: "Alert raised", acknowledged: "Alert acknowledged", inspection_scheduled: "Inspection scheduled for an alert",
  assigned: "Alert assigned to an inspector", comment: "Comment added to an alert", closed: "Alert closed",
};

export function buildChanges(rows: {
  baselines: BaselineVersionRow[]; settings: SettingsVersionRow[]; alerts: AlertChangeRow[]; audit: AuditChangeRow[];
}, assetId: string): ChangeItem[] {
  const items: ChangeItem[] = [];
  for (const b of rows.baselines) {
    items.push({
      at: new Date(b.createdAt).toISOString(), category: "baseline", by: b.byLabel, href: `/assets/${assetId}/baselines`,
      text: `Baseline version ${b.version} fitted (${b.status}${b.active ? ", active" : ""}; `
        + `training ${day(b.trainingFrom)} to ${day(b.trainingTo)}, ${b.modeCount} mode${b.modeCount === 1 ? "" : "s"}).`,
    });
  }
  for (const s of rows.settings) {
    items.push({
      at: new Date(s.createdAt).toISOString(), category: "settings", by: s.byLabel, href: `/assets/${assetId}/analysis`,
      text: s.version === 1 ? "Analysis settings version 1 (the first) saved." : `Analysis settings version ${s.version} saved.`,
    });
  }
  for (const a of rows.alerts) {
    const outcome = a.kind === "closed" ? str(a.details.outcome) : null;
    items.push({
      at: new Date(a.at).toISOString(), category: "alert", by: a.byLabel, href: `/alerts/${a.alertId}`,
      text: `${ALERT_WORDS[a.kind] ?? "Alert changed"}${outcome ? ` (${outcome.replaceAll("_", " ")})` : ""}.`,
    });
  }
  for (const r of rows.audit) {
    items.push({ at: new Date(r.at).toISOString(), by: r.byLabel, href: null, ...auditText(r) });
  }
  return items.sort((x, y) => y.at.localeCompare(x.at));
}
