/**
 * Modal history import (issue 5 §1, engineers and admins): a CSV of mode estimates from an
 * earlier monitoring system or a consultant. All or nothing: a file with any bad row imports
 * nothing and every bad row is named. Estimates are marked `import:<sha256 of the file>`,
 * so the same file imported again changes nothing. A mode label unknown on the asset creates
 * a tracked mode (nominal frequency = median of its imported values, default band).
 */
import { createHash } from "node:crypto";
import { db } from "@/lib/db/knex";
import { countEstimatesOfSource, insertModalEstimates } from "@/lib/db/repos/modal-estimate.repo";
import { insertTrackedMode, listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { enqueueDrift } from "@/lib/jobs/drift";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan } from "@/lib/services/authz";
import { DEFAULT_BAND_FRACTION } from "@/lib/services/tracking/schemas";
import { inspectHistoryCsv, parseHistoryCsv, type HistoryRow, type HistoryRowError } from "./history-csv";

export interface HistoryImportSummary {
  source: string;
  rows: number;
  /** Rows written now (0 when the same file was imported before). */
  imported: number;
  from: Date;
  to: Date;
  modes: { label: string; rows: number; created: boolean }[];
  preview: boolean;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Validate and (unless `preview`) import a modal history CSV into the asset.
 * @throws AppError forbidden (role), not_found (asset of another organisation),
 *   unprocessable with `details.rows = [{ line, reason }]` when any row is bad.
 */
export async function importModalHistory(
  actor: Actor, assetId: string, csvText: string, opts: { preview?: boolean } = {},
): Promise<HistoryImportSummary> {
  assertCan(actor, "baseline:write");
  const asset = await loadOwnAsset(actor, assetId);
  const { rows, errors } = parseHistoryCsv(csvText);
  if (errors.length > 0) {
    throw new AppError("unprocessable", `The file has ${errors.length} bad row(s); nothing was imported.`, { details: { rows: errors.slice(0, 500), errorCount: errors.length } });
  }
  const source = `import:${createHash("sha256").update(csvText).digest("hex")}`;
  const byLabel = new Map<string, HistoryRow[]>();
  for (const r of rows) byLabel.set(r.mode, [...(byLabel.get(r.mode) ?? []), r]);
  const times = rows.map((r) => r.at.getTime());
  const base = { source, rows: rows.length, from: new Date(Math.min(...times)), to: new Date(Math.max(...times)) };

  const existing = new Map((await listTrackedModesOfAsset(db(), asset.id, { includeInactive: true })).map((m) => [m.label, m]));
  const modes = [...byLabel.entries()].map(([label, rs]) => ({ label, rows: rs.length, created: !existing.has(label) }));
  if (opts.preview) return { ...base, imported: 0, modes, preview: true };

  const imported = await db().transaction(async (trx) => {
    const idOf = new Map<string, string>();
    for (const [label, rs] of byLabel) {
      const known = existing.get(label);
      if (known) { idOf.set(label, known.id); continue; }
      const nominal = median(rs.map((r) => r.frequencyHz));
      const mode = await insertTrackedMode(trx, asset.id, {
        label, nominalFrequencyHz: nominal, bandLowHz: nominal * (1 - DEFAULT_BAND_FRACTION), bandHighHz: nominal * (1 + DEFAULT_BAND_FRACTION), referenceShape: null,
      });
      idOf.set(label, mode.id);
      await recordAudit(trx, actor, {
        action: "tracked_mode.create", subjectType: "tracked_mode", subjectId: mode.id, details: { assetId: asset.id, label, nominalFrequencyHz: nominal, source: "history import" },
      });
    }
    const n = await insertModalEstimates(trx, asset.id, rows.map((r) => ({
      trackedModeId: idOf.get(r.mode) ?? "", at: r.at, frequencyHz: r.frequencyHz, dampingRatio: r.dampingRatio, temperatureC: r.temperatureC, source,
    })));
    if (n > 0) {
      await recordAudit(trx, actor, {
        action: "history.import", subjectType: "asset", subjectId: asset.id,
        details: { source, rows: rows.length, imported: n, from: base.from.toISOString(), to: base.to.toISOString(), modes },
      });
    }
    return n;
  });
  if (imported > 0) await enqueueDrift(asset.id);
  return { ...base, imported, modes, preview: false };
}

/** What the import page shows before the engineer confirms (nothing is written). */
export interface HistoryImportPreview {
  /** sha256 of the file, as `import:<hex>`; the confirm step sends the same file again. */
  source: string;
  /** Valid rows (the bad ones are in `errors`). */
  rows: number;
  from: Date | null;
  to: Date | null;
  modes: { label: string; rows: number; created: boolean }[];
  /** The first data rows as parsed (line numbers of the file). */
  firstRows: HistoryRow[];
  /** Every bad row (all when there are errors: nothing can be imported then). */
  errors: HistoryRowError[];
  /** Estimates of this very file the asset already holds (a re-import adds nothing). */
  alreadyImported: number;
}

/**
 * Dry run of {@link importModalHistory}: parse and summarise a file without writing, and
 * list every bad row instead of throwing.
 * @throws AppError forbidden (role), not_found (asset of another organisation).
 */
export async function previewModalHistory(actor: Actor, assetId: string, csvText: string, opts: { firstRows?: number } = {}): Promise<HistoryImportPreview> {
  assertCan(actor, "baseline:write");
  const asset = await loadOwnAsset(actor, assetId);
  const { rows, errors } = inspectHistoryCsv(csvText);
  const source = `import:${createHash("sha256").update(csvText).digest("hex")}`;
  const existing = new Set((await listTrackedModesOfAsset(db(), asset.id, { includeInactive: true })).map((m) => m.label));
  const count = new Map<string, number>();
  let lo = Infinity;
  let hi = -Infinity;
  for (const r of rows) {
    count.set(r.mode, (count.get(r.mode) ?? 0) + 1);
    lo = Math.min(lo, r.at.getTime());
    hi = Math.max(hi, r.at.getTime());
  }
  return {
    source,
    rows: rows.length,
    from: rows.length ? new Date(lo) : null,
    to: rows.length ? new Date(hi) : null,
    modes: [...count.entries()].map(([label, n]) => ({ label, rows: n, created: !existing.has(label) })),
    firstRows: rows.slice(0, opts.firstRows ?? 10),
    errors,
    alreadyImported: errors.length === 0 ? await countEstimatesOfSource(db(), asset.id, source) : 0,
  };
}

/** How many estimates of `source` the asset holds (for tests and the preview). */
export async function countImportedEstimates(assetId: string, source: string): Promise<number> {
  return countEstimatesOfSource(db(), assetId, source);
}
