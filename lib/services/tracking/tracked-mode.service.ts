/**
 * Tracked modes of an asset (issue 4 §5): everyone reads them with their identification rate;
 * engineers and admins (`mode:write`) create, edit and deactivate them. "Track this mode"
 * takes the frequency and real shape of an identified mode of a record; a design or FE
 * frequency may be entered by hand instead. Deleting deactivates: the mode is no longer
 * assigned in new analyses, and its past assignments stay as history.
 */
import { db, type Db } from "@/lib/db/knex";
import { listModesOfResult, listResultsOfRecord } from "@/lib/db/repos/analysis-result.repo";
import {
  countIdentificationsOfAsset, findTrackedModeById, insertTrackedMode, listTrackedModesOfAsset, updateTrackedModeById,
} from "@/lib/db/repos/tracked-mode.repo";
import type { TrackedMode } from "@/lib/domain/records";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { loadRecordOfAsset } from "@/lib/services/analysis/reprocess.service";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan, isUuid } from "@/lib/services/authz";
import { DEFAULT_BAND_FRACTION, type CreateTrackedModeInput, type UpdateTrackedModeInput } from "./schemas";

export interface TrackedModeView extends TrackedMode {
  /** Analysed records (current result) in which the mode was sought, and found. */
  identification: { analysed: number; identified: number; rate: number | null; lastIdentifiedAt: Date | null };
}

/** Tracked modes of the asset with their identification rate (share of analysed records that found them). */
export async function listTrackedModes(actor: Actor, assetId: string, opts: { includeInactive?: boolean } = {}): Promise<TrackedModeView[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const [modes, counts] = await Promise.all([
    listTrackedModesOfAsset(db(), asset.id, { includeInactive: opts.includeInactive }),
    countIdentificationsOfAsset(db(), asset.id),
  ]);
  const byId = new Map(counts.map((c) => [c.trackedModeId, c]));
  return modes.map((m) => {
    const c = byId.get(m.id);
    const analysed = c?.analysed ?? 0;
    const identified = c?.identified ?? 0;
    return { ...m, identification: { analysed, identified, rate: analysed ? identified / analysed : null, lastIdentifiedAt: c?.lastIdentifiedAt ?? null } };
  });
}

const bandError = (field: string, message: string) => new AppError("unprocessable", message, { fieldErrors: { [field]: [message] } });

/** Create a tracked mode, by hand or from mode `fromModeIndex` of record `fromRecordId` (its latest result). */
export async function createTrackedMode(actor: Actor, assetId: string, input: CreateTrackedModeInput): Promise<TrackedMode> {
  assertCan(actor, "mode:write");
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    let nominal = input.nominalFrequencyHz ?? null;
    let shape = input.referenceShape ?? null;
    let source: { recordId: string; modeIndex: number } | null = null;
    if (input.fromRecordId !== undefined && input.fromModeIndex !== undefined) {
      const { record } = await loadRecordOfAsset(actor, asset.id, input.fromRecordId, trx);
      const [latest] = await listResultsOfRecord(trx, record.id);
      const mode = latest ? (await listModesOfResult(trx, latest.id)).find((m) => m.modeIndex === input.fromModeIndex) : undefined;
      if (!mode) throw bandError("fromModeIndex", "That record has no identified mode with this index.");
      nominal ??= mode.frequencyHz;
      if (input.referenceShape === undefined) shape = mode.shape;
      source = { recordId: record.id, modeIndex: mode.modeIndex };
    }
    if (nominal === null) throw bandError("nominalFrequencyHz", "Nominal frequency is required (or pick a mode of a record).");
    const lo = input.bandLowHz ?? nominal * (1 - DEFAULT_BAND_FRACTION);
    const hi = input.bandHighHz ?? nominal * (1 + DEFAULT_BAND_FRACTION);
    checkBand(nominal, lo, hi);
    const mode = await insertTrackedMode(trx, asset.id, {
      label: input.label, nominalFrequencyHz: nominal, bandLowHz: lo, bandHighHz: hi, referenceShape: shape,
      sourceRecordId: source?.recordId ?? null, sourceModeIndex: source?.modeIndex ?? null,
    });
    await recordAudit(trx, actor, {
      action: "tracked_mode.create", subjectType: "tracked_mode", subjectId: mode.id,
      details: { assetId: asset.id, label: mode.label, nominalFrequencyHz: nominal, bandHz: [lo, hi], source },
    });
    return mode;
  });
}

/** Edit a tracked mode (label, nominal frequency, band, reference shape, active). */
export async function updateTrackedMode(actor: Actor, assetId: string, trackedModeId: string, input: UpdateTrackedModeInput): Promise<TrackedMode> {
  assertCan(actor, "mode:write");
  return db().transaction(async (trx) => {
    const { asset, mode } = await loadOwnTrackedMode(actor, assetId, trackedModeId, trx);
    checkBand(input.nominalFrequencyHz ?? mode.nominalFrequencyHz, input.bandLowHz ?? mode.bandLowHz, input.bandHighHz ?? mode.bandHighHz);
    const updated = await updateTrackedModeById(trx, mode.id, input);
    if (!updated) throw new AppError("not_found", "No such tracked mode.");
    await recordAudit(trx, actor, {
      action: "tracked_mode.update", subjectType: "tracked_mode", subjectId: mode.id, details: { assetId: asset.id, changes: input },
    });
    return updated;
  });
}

/** Deactivate a tracked mode (idempotent); its history stays. */
export async function deleteTrackedMode(actor: Actor, assetId: string, trackedModeId: string): Promise<TrackedMode> {
  assertCan(actor, "mode:write");
  return db().transaction(async (trx) => {
    const { asset, mode } = await loadOwnTrackedMode(actor, assetId, trackedModeId, trx);
    if (!mode.active) return mode;
    const updated = await updateTrackedModeById(trx, mode.id, { active: false });
    if (!updated) throw new AppError("not_found", "No such tracked mode.");
    await recordAudit(trx, actor, {
      action: "tracked_mode.deactivate", subjectType: "tracked_mode", subjectId: mode.id, details: { assetId: asset.id, label: mode.label },
    });
    return updated;
  });
}

async function loadOwnTrackedMode(actor: Actor, assetId: string, trackedModeId: string, trx: Db) {
  const asset = await loadOwnAsset(actor, assetId, trx);
  const mode = isUuid(trackedModeId) ? await findTrackedModeById(trx, trackedModeId) : null;
  if (!mode || mode.assetId !== asset.id) throw new AppError("not_found", "No such tracked mode.");
  return { asset, mode };
}

function checkBand(nominal: number, lo: number, hi: number): void {
  if (!(lo < hi)) throw bandError("bandHighHz", "The band's high edge must be above its low edge.");
  if (lo > nominal) throw bandError("bandLowHz", "The band must contain the nominal frequency.");
  if (hi < nominal) throw bandError("bandHighHz", "The band must contain the nominal frequency.");
}
