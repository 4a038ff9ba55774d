/**
 * Baselines (issue 5 §2, engineers and admins): per tracked mode a model of frequency against
 * temperature (lib/stats fitBaseline: linear, bilinear with a knot near 0 °C, or chosen by
 * BIC) fitted on a training window of the asset's history (analysed records and imported
 * estimates). Each fit is a new version and becomes the active one; earlier versions stay
 * (superseded) for comparison. Audited; the drift replay is queued afterwards.
 */
import { db } from "@/lib/db/knex";
import { insertActiveBaseline, listBaselineAuthorNames, listBaselinesOfAsset } from "@/lib/db/repos/baseline.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { Baseline, BaselineModeModel } from "@/lib/domain/drift";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { enqueueDrift } from "@/lib/jobs/drift";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan } from "@/lib/services/authz";
import { fitBaseline } from "@/lib/stats/baseline-fit";
import { loadAssetHistory } from "./history";
import { FitBaselineInput } from "./schemas";

/** Least identified points of a mode in the window to fit it (fitBaseline needs 8). */
const MIN_POINTS = 8;

/** Versions of the asset's baseline, newest first (everyone in the organisation reads). */
export async function listBaselines(actor: Actor, assetId: string): Promise<Baseline[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  return listBaselinesOfAsset(db(), asset.id);
}

/** Versions newest first with the display name of who fitted each (null: the system or a removed user). */
export async function listBaselineVersions(actor: Actor, assetId: string): Promise<(Baseline & { createdByName: string | null })[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const [versions, names] = await Promise.all([listBaselinesOfAsset(db(), asset.id), listBaselineAuthorNames(db(), asset.id)]);
  return versions.map((b) => ({ ...b, createdByName: names.get(b.id) ?? null }));
}

/**
 * Fit a baseline on the window [from, to) for every active tracked mode with enough
 * identified, quality-passed points, and activate it.
 * @throws AppError forbidden / not_found; unprocessable when no mode can be fitted (with
 *   the reason per mode in details.modes).
 */
export async function fitAndActivateBaseline(actor: Actor, assetId: string, input: FitBaselineInput): Promise<Baseline> {
  assertCan(actor, "baseline:write");
  const { from, to, model } = FitBaselineInput.parse(input);
  const asset = await loadOwnAsset(actor, assetId);
  const modes = await listTrackedModesOfAsset(db(), asset.id);
  const { history } = await loadAssetHistory(db(), asset.id, modes.map((m) => m.id), { from, to });
  const q = history.qualityPassed ?? new Uint8Array(history.timesMs.length).fill(1);
  const fitted: BaselineModeModel[] = [];
  const skipped: { label: string; reason: string }[] = [];
  modes.forEach((m, j) => {
    const f = history.modes[j].frequencyHz;
    const idx: number[] = [];
    for (let i = 0; i < f.length; i++) if (q[i] && !Number.isNaN(f[i])) idx.push(i);
    if (idx.length < MIN_POINTS) {
      skipped.push({ label: m.label, reason: `${idx.length} identified points in the window (at least ${MIN_POINTS} needed)` });
      return;
    }
    const pick = (a: ArrayLike<number>) => Float64Array.from(idx, (i) => a[i]);
    try {
      fitted.push({ trackedModeId: m.id, label: m.label, model: fitBaseline({ timesMs: pick(history.timesMs), frequencyHz: pick(f), temperatureC: pick(history.temperatureC) }, { model }) });
    } catch (e) {
      if (!(e instanceof RangeError)) throw e;
      skipped.push({ label: m.label, reason: e.message });
    }
  });
  if (fitted.length === 0) {
    throw new AppError("unprocessable", "No tracked mode has enough data in this window to fit a baseline.", { details: { modes: skipped } });
  }
  const status = fitted.every((x) => x.model.status === "complete") ? "complete" : "provisional";
  const baseline = await db().transaction(async (trx) => {
    const { baseline: b, superseded } = await insertActiveBaseline(trx, {
      assetId: asset.id, trainingFrom: from, trainingTo: to, status, requestedModel: model, models: fitted, createdByUserId: actor.userId,
    });
    await recordAudit(trx, actor, {
      action: "baseline.create", subjectType: "baseline", subjectId: b.id,
      details: {
        assetId: asset.id, version: b.version, supersededVersion: superseded, from: from.toISOString(), to: to.toISOString(), model, status,
        modes: fitted.map((x) => ({ label: x.label, kind: x.model.kind, knotC: x.model.knotC, residualStdHz: x.model.residualStdHz, n: x.model.n })),
        skipped,
      },
    });
    return b;
  });
  await enqueueDrift(asset.id);
  return baseline;
}
