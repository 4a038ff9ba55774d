/**
 * The Portfolio's "needs attention" list (issue 6 §5), built from plain rows so the rules
 * are testable without a database. One item per thing to look at, each with a link:
 * alerts that are not closed, assets on watch, silent assets (condition silent, or no
 * accepted record for longer than the expected interval), channels excluded by a quality
 * flag in the latest record, commissioning assets without a baseline, provisional baselines.
 */
import type { AlertState, BaselineStatus } from "@/lib/domain/drift";
import type { AssetCondition } from "@/lib/domain/types";

export const ATTENTION_KINDS = ["alert", "watch", "silent", "data", "no_baseline", "provisional_baseline"] as const;
export type AttentionKind = (typeof ATTENTION_KINDS)[number];

export interface AttentionItem {
  kind: AttentionKind;
  assetId: string;
  assetName: string;
  /** Where to go: the alert, or the asset's Overview. */
  href: string;
  title: string;
  detail: string;
  /** ISO 8601 time the item refers to (raise, last record), or null. */
  at: string | null;
}

export interface AttentionInput {
  alerts: { id: string; assetId: string; assetName: string; state: AlertState; raisedAt: Date }[];
  assets: {
    assetId: string; assetName: string; condition: AssetCondition; expectedIntervalMin: number;
    baselineStatus: BaselineStatus | null; baselineVersion: number | null; lastAnalysedAt: Date | null;
  }[];
  channelIssues: { assetId: string; assetName: string; channel: string; flags: string[]; latestAt: Date; recentRecords: number; recentExcluded: number }[];
  /** Length of the window of recentRecords, days. */
  recentDays: number;
  now: Date;
}

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;

const STATE_WORDS: Record<AlertState, string> = {
  open: "open", acknowledged: "acknowledged", inspection_scheduled: "inspection scheduled", closed: "closed",
};

const FLAG_WORDS: Record<string, string> = {
  flat_line: "flat-lined", clipping: "clipping", gap: "gaps in the data", non_finite: "invalid samples",
};

/** "3 days", "5 hours", "less than an hour". */
export function formatSpan(ms: number): string {
  if (ms >= 2 * DAY_MS) return `${Math.floor(ms / DAY_MS)} days`;
  if (ms >= HOUR_MS) { const h = Math.floor(ms / HOUR_MS); return `${h} hour${h === 1 ? "" : "s"}`; }
  return "less than an hour";
}

/** The list, most urgent kind first (ATTENTION_KINDS order), then by asset name. */
export function buildAttention(input: AttentionInput): AttentionItem[] {
  const items: AttentionItem[] = [];
  for (const a of input.alerts) {
    items.push({
      kind: "alert", assetId: a.assetId, assetName: a.assetName, href: `/alerts/${a.id}`,
      title: `Alert ${STATE_WORDS[a.state]}`, detail: `Raised ${formatSpan(input.now.getTime() - a.raisedAt.getTime())} ago.`,
      at: a.raisedAt.toISOString(),
    });
  }
  for (const a of input.assets) {
    const href = `/assets/${a.assetId}`;
    const base = { assetId: a.assetId, assetName: a.assetName, href };
    if (a.condition === "watch") {
      items.push({ ...base, kind: "watch", title: "On watch", detail: "Early warning from the drift statistics, not confirmed.", at: null });
    }
    const overdue = a.lastAnalysedAt !== null && input.now.getTime() - a.lastAnalysedAt.getTime() > a.expectedIntervalMin * 60_000;
    if (a.condition === "silent" || overdue) {
      items.push({
        ...base, kind: "silent", title: "Silent",
        detail: a.lastAnalysedAt
          ? `No accepted record for ${formatSpan(input.now.getTime() - a.lastAnalysedAt.getTime())} (expected every ${formatSpan(a.expectedIntervalMin * 60_000)}).`
          : "No accepted record yet.",
        at: a.lastAnalysedAt ? a.lastAnalysedAt.toISOString() : null,
      });
    }
    if (a.baselineStatus === null && a.condition === "commissioning") {
      items.push({ ...base, kind: "no_baseline", title: "No baseline", detail: "Commissioning: drift is not judged until an engineer fits a baseline.", at: null });
    } else if (a.baselineStatus === "provisional") {
      items.push({
        ...base, kind: "provisional_baseline", title: "Provisional baseline",
        detail: `Baseline version ${a.baselineVersion ?? "?"} covers less than a full year of seasons.`, at: null,
      });
    }
  }
  for (const c of input.channelIssues) {
    const words = c.flags.filter((f) => f in FLAG_WORDS).map((f) => FLAG_WORDS[f]).join(", ") || "excluded";
    items.push({
      kind: "data", assetId: c.assetId, assetName: c.assetName, href: `/assets/${c.assetId}#availability`,
      title: `Sensor ${c.channel} ${words}`,
      detail: `Excluded from the latest record and from ${c.recentExcluded} of ${c.recentRecords} records in the last ${input.recentDays} days.`,
      at: c.latestAt.toISOString(),
    });
  }
  const rank = (k: AttentionKind) => ATTENTION_KINDS.indexOf(k);
  return items.sort((x, y) => rank(x.kind) - rank(y.kind) || x.assetName.localeCompare(y.assetName) || x.title.localeCompare(y.title));
}
