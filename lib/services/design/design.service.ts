/**
 * Design (FE) modes of an asset and their comparison with the measured tracked modes
 * (issue 6 §4). Everyone in the organisation reads; engineers and admins (`mode:write`) write.
 * Measured values: the identifications of each tracked mode in the last `days` days (30 by
 * default) — median and latest — and the median measured shape for MAC.
 */
import { db, type Db } from "@/lib/db/knex";
import {
  deleteDesignModeById, findDesignModeById, insertDesignMode, listDesignModesOfAsset, updateDesignModeById,
} from "@/lib/db/repos/design-mode.repo";
import { listModeObservations } from "@/lib/db/repos/serviceability.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { TrackedMode } from "@/lib/domain/records";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { compareDesignModes, median, type ComparisonRow } from "@/lib/serviceability/design-compare";
import type { DesignMode } from "@/lib/serviceability/types";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan, isUuid } from "@/lib/services/authz";
import type { DesignModeInput } from "./schemas";

const DAY_MS = 86_400_000;

export async function listDesignModes(actor: Actor, assetId: string): Promise<DesignMode[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  return listDesignModesOfAsset(db(), asset.id);
}

async function checkLink(trx: Db, assetId: string, trackedModeId: string | null): Promise<void> {
  if (trackedModeId === null) return;
  const modes = await listTrackedModesOfAsset(trx, assetId, { includeInactive: true });
  if (!modes.some((m) => m.id === trackedModeId)) {
    throw new AppError("unprocessable", "That tracked mode is not on this asset.", { fieldErrors: { trackedModeId: ["That tracked mode is not on this asset."] } });
  }
}

const labelConflict = (e: unknown) =>
  e instanceof AppError && e.code === "conflict"
    ? new AppError("conflict", "Another design mode of this asset has this label.", { fieldErrors: { label: ["Another design mode of this asset has this label."] } })
    : e;

export async function createDesignMode(actor: Actor, assetId: string, input: DesignModeInput): Promise<DesignMode> {
  assertCan(actor, "mode:write");
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    await checkLink(trx, asset.id, input.trackedModeId);
    const mode = await insertDesignMode(trx, asset.id, actor.userId, input).catch((e: unknown) => { throw labelConflict(e); });
    await recordAudit(trx, actor, {
      action: "design_mode.create", subjectType: "design_mode", subjectId: mode.id,
      details: { assetId: asset.id, label: mode.label, frequencyHz: mode.frequencyHz },
    });
    return mode;
  });
}

async function loadOwnDesignMode(actor: Actor, assetId: string, designModeId: string, trx: Db) {
  const asset = await loadOwnAsset(actor, assetId, trx);
  const mode = isUuid(designModeId) ? await findDesignModeById(trx, designModeId) : null;
  if (!mode || mode.assetId !== asset.id) throw new AppError("not_found", "No such design mode.");
  return { asset, mode };
}

export async function updateDesignMode(actor: Actor, assetId: string, designModeId: string, input: DesignModeInput): Promise<DesignMode> {
  assertCan(actor, "mode:write");
  return db().transaction(async (trx) => {
    const { asset, mode } = await loadOwnDesignMode(actor, assetId, designModeId, trx);
    await checkLink(trx, asset.id, input.trackedModeId);
    const updated = await updateDesignModeById(trx, mode.id, input).catch((e: unknown) => { throw labelConflict(e); });
    if (!updated) throw new AppError("not_found", "No such design mode.");
    await recordAudit(trx, actor, { action: "design_mode.update", subjectType: "design_mode", subjectId: mode.id, details: { assetId: asset.id, changes: input } });
    return updated;
  });
}

export async function deleteDesignMode(actor: Actor, assetId: string, designModeId: string): Promise<void> {
  assertCan(actor, "mode:write");
  await db().transaction(async (trx) => {
    const { asset, mode } = await loadOwnDesignMode(actor, assetId, designModeId, trx);
    await deleteDesignModeById(trx, mode.id);
    await recordAudit(trx, actor, { action: "design_mode.delete", subjectType: "design_mode", subjectId: mode.id, details: { assetId: asset.id, label: mode.label } });
  });
}

/** Per channel, the median of the shapes' values (each shape scaled to max |value| = 1 already). */
function medianShape(shapes: Record<string, number>[]): Record<string, number> | null {
  if (shapes.length === 0) return null;
  const codes = new Set(shapes.flatMap((s) => Object.keys(s)));
  const out: Record<string, number> = {};
  for (const c of codes) {
    const m = median(shapes.map((s) => s[c]).filter((v): v is number => Number.isFinite(v)));
    if (m !== null) out[c] = m;
  }
  return out;
}

export interface DesignComparison {
  periodDays: number;
  from: Date;
  to: Date;
  designModes: DesignMode[];
  trackedModes: TrackedMode[];
  rows: ComparisonRow[];
}

/** The comparison table (design vs measured) over the last `days` days up to `now`. */
export async function getDesignComparison(actor: Actor, assetId: string, opts: { days?: number; now?: Date } = {}): Promise<DesignComparison> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const periodDays = opts.days ?? 30;
  const to = opts.now ?? new Date();
  const from = new Date(to.getTime() - periodDays * DAY_MS);
  const [designModes, trackedModes, observations] = await Promise.all([
    listDesignModesOfAsset(db(), asset.id),
    listTrackedModesOfAsset(db(), asset.id),
    listModeObservations(db(), asset.id, from, new Date(to.getTime() + 1)),
  ]);
  const rows = compareDesignModes(designModes, trackedModes.map((t) => {
    const obs = observations.filter((o) => o.trackedModeId === t.id);
    // Sign of each measured shape aligned to the reference (or first) shape before the median.
    const ref = t.referenceShape ?? obs[0]?.shape ?? null;
    const aligned = obs.map((o) => {
      const dot = ref ? Object.keys(ref).reduce((s, c) => s + (ref[c] ?? 0) * (o.shape[c] ?? 0), 0) : 1;
      return dot < 0 ? Object.fromEntries(Object.entries(o.shape).map(([c, v]) => [c, -v])) : o.shape;
    });
    return {
      id: t.id, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz, frequenciesHz: obs.map((o) => o.frequencyHz),
      shape: medianShape(aligned) ?? t.referenceShape,
    };
  }));
  return { periodDays, from, to, designModes, trackedModes, rows };
}
