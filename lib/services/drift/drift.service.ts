/**
 * The drift step (PRODUCT.md §Data flow 4–5), run by the `drift` worker: replay the asset's
 * whole history with its active baseline through lib/stats runDriftMonitor (residuals after
 * temperature compensation, daily means, EWMA, Hotelling T², condition machine), store the
 * final condition on the asset, and raise an alert for every `alert_raised` event not raised
 * before (one per asset and raise time, and none while another alert of the asset is not
 * closed), e-mailing the organisation's inspectors and engineers through the mail queue.
 * The replay is pure and the inserts are keyed, so running it twice changes nothing.
 */
import { env } from "@/lib/config/env";
import { db } from "@/lib/db/knex";
import { hasLiveAlert, insertAlertEvent, insertAlertIfNew, listMemberAddresses } from "@/lib/db/repos/alert.repo";
import { findAssetById, updateAssetById } from "@/lib/db/repos/asset.repo";
import { findActiveBaseline } from "@/lib/db/repos/baseline.repo";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import type { Alert, Baseline } from "@/lib/domain/drift";
import type { AssetCondition } from "@/lib/domain/types";
import { alertRaisedEmail } from "@/lib/email/templates/alert-raised";
import { enqueueMail } from "@/lib/jobs/queues";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { withoutMutedRecipients } from "@/lib/services/accounts/notification.service";
import { conditionWithAlerts } from "@/lib/services/alerts/condition";
import { runDriftMonitor, type DriftMonitorResult } from "@/lib/stats/drift-monitor";
import type { AlertEvidence } from "@/lib/stats/condition-machine";
import { loadAssetHistory } from "./history";

export interface DriftOutcome {
  assetId: string;
  condition: AssetCondition;
  /** Why no statistics were computed (no baseline, too little data), else null. */
  skipped: string | null;
  raisedAlertIds: string[];
  minimalShift: { trackedModeId: string; label: string; shiftHz: number; shiftPct: number }[];
}

/** Replay the drift statistics of one asset from scratch and act on the result (see header). */
export async function recomputeDrift(assetId: string, opts: { nowMs?: number } = {}): Promise<DriftOutcome> {
  const asset = await findAssetById(db(), assetId);
  if (!asset) return { assetId, condition: "commissioning", skipped: "asset does not exist", raisedAlertIds: [], minimalShift: [] };
  const baseline = await findActiveBaseline(db(), asset.id);
  const setCondition = async (c: AssetCondition) => {
    if (asset.condition !== c) await updateAssetById(db(), asset.id, { condition: c });
  };
  if (!baseline) {
    await setCondition("commissioning");
    return { assetId, condition: "commissioning", skipped: "no active baseline", raisedAlertIds: [], minimalShift: [] };
  }
  const modeIds = baseline.models.map((m) => m.trackedModeId);
  const { history, recordTimesMs } = await loadAssetHistory(db(), asset.id, modeIds, { from: baseline.trainingFrom });
  let result: DriftMonitorResult;
  try {
    result = runDriftMonitor(history, {
      trainingEndMs: baseline.trainingTo.getTime(),
      baseline: { model: baseline.requestedModel },
      condition: {
        recordTimesMs, endMs: opts.nowMs ?? Date.now(),
        ...(recordTimesMs.length > 0 ? { expectedIntervalMs: asset.expectedIntervalMin * 60_000 } : {}),
      },
    });
  } catch (e) {
    // Too little data in the window (e.g. the tracked modes changed since the fit): no decision.
    if (e instanceof RangeError || e instanceof TypeError) {
      return { assetId, condition: asset.condition, skipped: e.message, raisedAlertIds: [], minimalShift: [] };
    }
    throw e;
  }
  const raised: { alert: Alert; evidence: AlertEvidence }[] = [];
  for (const ev of result.condition.events) {
    if (ev.type !== "alert_raised") continue;
    const alert = await raiseAlert(asset.id, asset.organisationId, baseline, ev.timeMs, ev.evidence, result);
    if (alert) raised.push({ alert, evidence: ev.evidence });
  }
  // `alert` only while an inspection is asked (an alert not closed): PRODUCT.md, see conditionWithAlerts.
  const condition = conditionWithAlerts(result.condition.finalState, await hasLiveAlert(db(), asset.id));
  await setCondition(condition);
  if (raised.length > 0) await notifyRaised(asset.organisationId, asset.name, baseline, raised);
  const raisedAlertIds = raised.map((r) => r.alert.id);
  return {
    assetId, condition, skipped: null, raisedAlertIds,
    minimalShift: result.minimalShift.map((s, j) => ({ trackedModeId: modeIds[j], label: baseline.models[j].label, ...s })),
  };
}

/** The stored snapshot: the lib/stats evidence plus labels, baseline version and nominal frequencies. */
function evidenceSnapshot(baseline: Baseline, evidence: AlertEvidence, result: DriftMonitorResult): Record<string, unknown> {
  const labels = Object.fromEntries(baseline.models.map((m) => [m.trackedModeId, m.label]));
  return {
    ...evidence,
    baselineId: baseline.id,
    baselineVersion: baseline.version,
    modeLabels: labels,
    sigmaHz: Object.fromEntries(baseline.models.map((m, j) => [m.trackedModeId, result.sigmaHz[j]])),
    nominalHz: Object.fromEntries(baseline.models.map((m) => [m.trackedModeId, m.model.interceptHz + m.model.slopeHzPerC * 20])),
    t2Ucl: result.t2Ucl,
  };
}

async function raiseAlert(
  assetId: string, organisationId: string, baseline: Baseline, timeMs: number, evidence: AlertEvidence, result: DriftMonitorResult,
): Promise<Alert | null> {
  return db().transaction(async (trx) => {
    const alert = await insertAlertIfNew(trx, { assetId, raisedAt: new Date(timeMs), evidence: evidenceSnapshot(baseline, evidence, result) });
    if (!alert) return null;
    await insertAlertEvent(trx, { alertId: alert.id, actorUserId: null, kind: "raised", details: { rule: evidence.rule, modesBeyond: evidence.modesBeyond } });
    await recordAudit(trx, { organisationId, userId: null }, {
      action: "alert.raise", subjectType: "alert", subjectId: alert.id,
      details: { assetId, raisedAt: alert.raisedAt.toISOString(), rule: evidence.rule, baselineVersion: baseline.version },
    });
    return alert;
  });
}

/** One e-mail per new alert and recipient (job id keyed, so a retry sends nothing twice). */
async function notifyRaised(organisationId: string, assetName: string, baseline: Baseline, raised: { alert: Alert; evidence: AlertEvidence }[]) {
  const [org, recipients] = await Promise.all([
    findOrganisationById(db(), organisationId), listMemberAddresses(db(), organisationId, ["inspector", "engineer"]),
  ]);
  const base = env().APP_URL.replace(/\/$/, "");
  for (const { alert: a, evidence } of raised) {
    const p = evidence.point;
    const message = alertRaisedEmail({
      organisationName: org?.name ?? "your organisation", assetName, raisedAt: a.raisedAt, rule: evidence.rule,
      baselineVersion: baseline.version, link: `${base}/alerts/${a.id}`, t2: p.t2 ?? null,
      modes: p.modes.map((m) => {
        const model = baseline.models.find((x) => x.trackedModeId === m.modeId);
        const nominal = model ? model.model.interceptHz + model.model.slopeHzPerC * 20 : Number.NaN;
        return {
          label: model?.label ?? m.modeId, residualHz: m.residualHz, lowerLimitHz: m.residualLcl, upperLimitHz: m.residualUcl,
          residualPct: Number.isFinite(nominal) && nominal > 0 && Number.isFinite(m.residualHz) ? (100 * m.residualHz) / nominal : null,
        };
      }),
    });
    // Members who muted this asset on their Account page get no e-mail.
    for (const r of await withoutMutedRecipients(db(), a.assetId, recipients)) {
      await enqueueMail({ to: r.email, ...message }, { jobId: `alert-raised-${a.id}-${r.userId}` });
    }
  }
}
