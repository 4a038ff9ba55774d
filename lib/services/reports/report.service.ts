/**
 * Asset reports (issue 6 part 4): gathers what lib/reports lays out for one asset and one
 * period: the drift view (lib/services/drift/drift-view.service.ts) for the series, the
 * baseline fit and the smallest detectable change; the alerts with their outcomes; the
 * accepted and rejected rows for the data availability and the identification rate.
 * Everyone in the organisation reads (`portfolio:read`); another organisation's asset is
 * not_found.
 */
import { env } from "@/lib/config/env";
import { db } from "@/lib/db/knex";
import { listAlertsOfOrganisation } from "@/lib/db/repos/alert.repo";
import { listHistoryPoints } from "@/lib/db/repos/modal-estimate.repo";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import type { Alert } from "@/lib/domain/drift";
import type { Actor, Asset, AssetCondition } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { REPORT_CAUTION } from "@/lib/reports/caution";
import type { AssetReport, ReportAlert, ReportAvailability, ReportMode } from "@/lib/reports/report-data";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan } from "@/lib/services/authz";
import { getDriftView, type DriftView, type DriftViewMode } from "@/lib/services/drift/drift-view.service";

const DAY_MS = 86_400_000;
/** Longest period a report covers (the charts stay readable, the replay stays bounded). */
export const MAX_REPORT_DAYS = 400;

export interface ReportPeriod { from: Date; to: Date }

/** The default period: the 30 days up to now (end exclusive). */
export function defaultPeriod(nowMs = Date.now()): ReportPeriod {
  return { from: new Date(nowMs - 30 * DAY_MS), to: new Date(nowMs) };
}

/** The calendar month (UTC) before the one holding `nowMs`, as [first day, first day of next month). */
export function previousMonth(nowMs: number): ReportPeriod & { label: string } {
  const d = new Date(nowMs);
  const from = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() - 1, 1));
  const to = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1));
  return { from, to, label: from.toISOString().slice(0, 7) };
}

function checkPeriod(p: ReportPeriod): void {
  const span = p.to.getTime() - p.from.getTime();
  if (!(span > 0)) throw new AppError("unprocessable", "The period must end after it starts.", { fieldErrors: { to: ["must be after from"] } });
  if (span > MAX_REPORT_DAYS * DAY_MS) {
    throw new AppError("unprocessable", `A report covers at most ${MAX_REPORT_DAYS} days.`, { fieldErrors: { from: [`at most ${MAX_REPORT_DAYS} days before to`] } });
  }
}

const median = (xs: number[]): number | null => {
  if (xs.length === 0) return null;
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/** Accepted rows of the period and, per tracked mode, in how many it was identified. */
async function countRows(assetId: string, p: ReportPeriod, expectedIntervalMin: number) {
  const points = await listHistoryPoints(db(), assetId, { from: p.from, to: p.to });
  const rows = new Map<string, { at: number; ok: boolean; rec: boolean; modes: Set<string> }>();
  for (const pt of points) {
    let r = rows.get(pt.key);
    if (!r) rows.set(pt.key, (r = { at: pt.at.getTime(), ok: pt.qualityPassed, rec: pt.fromRecord, modes: new Set() }));
    if (pt.trackedModeId && pt.frequencyHz !== null) r.modes.add(pt.trackedModeId);
  }
  const accepted = [...rows.values()].filter((r) => r.ok).sort((a, b) => a.at - b.at);
  const times = [p.from.getTime(), ...accepted.map((r) => r.at), p.to.getTime()];
  let gap = 0;
  for (let i = 1; i < times.length; i++) gap = Math.max(gap, times[i] - times[i - 1]);
  const expected = Math.floor((p.to.getTime() - p.from.getTime()) / (expectedIntervalMin * 60_000));
  const availability: ReportAvailability = {
    expected, accepted: accepted.length, rejected: rows.size - accepted.length, fromRecords: accepted.filter((r) => r.rec).length,
    coverage: expected > 0 ? Math.min(1, accepted.length / expected) : null, longestGapH: gap / 3_600_000,
  };
  const identified = (modeId: string) => accepted.filter((r) => r.modes.has(modeId)).length;
  return { availability, identified };
}

function reportMode(m: DriftViewMode, identified: number, accepted: number): ReportMode {
  const pts = m.points;
  const lastDay = m.daily.length ? m.daily[m.daily.length - 1] : null;
  const centre = lastDay ? (lastDay.ewmaLcl + lastDay.ewmaUcl) / 2 : Number.NaN;
  const damping = m.damping.points.map((p) => p.dampingRatio);
  return {
    trackedModeId: m.trackedModeId, label: m.label, nominalHz: m.nominalHz,
    latestHz: pts.length ? pts[pts.length - 1].frequencyHz : null, latestAtMs: pts.length ? pts[pts.length - 1].atMs : null,
    medianHz: median(pts.map((p) => p.frequencyHz)), medianDampingRatio: median(damping),
    identified, accepted, identificationRate: accepted > 0 ? identified / accepted : null,
    sustainedChangePct: lastDay && Number.isFinite(centre) && m.nominalHz > 0 ? (100 * (lastDay.ewma - centre)) / m.nominalHz : null,
    minimalShift: m.minimalShift,
    fit: m.model ? {
      kind: m.model.kind, residualStdHz: m.model.residualStdHz, n: m.model.n, slopeHzPerC: m.model.slopeHzPerC,
      temperatureRangeC: m.model.envelope.temperatureC,
    } : null,
    series: {
      points: pts.map((p) => ({ atMs: p.atMs, frequencyHz: p.frequencyHz, predictedHz: p.predictedHz, dampingRatio: p.dampingRatio })),
      daily: m.daily.flatMap((d) => (d.residualHz === null ? [] : [{ dayMs: d.dayMs, residualHz: d.residualHz, ewma: d.ewma, ewmaLcl: d.ewmaLcl, ewmaUcl: d.ewmaUcl }])),
    },
  };
}

/** Alerts that touch the period: raised in it, still open at its end, or closed in it. */
function reportAlerts(alerts: Alert[], view: DriftView, p: ReportPeriod): ReportAlert[] {
  const labels = new Map(view.modes.map((m) => [m.trackedModeId, m.label]));
  const from = p.from.getTime();
  const to = p.to.getTime();
  return alerts
    .filter((a) => a.raisedAt.getTime() < to && (a.closedAt === null || a.closedAt.getTime() >= from))
    .sort((a, b) => a.raisedAt.getTime() - b.raisedAt.getTime())
    .map((a) => {
      const ev = a.evidence;
      const beyond = Array.isArray(ev.modesBeyond) ? ev.modesBeyond.filter((x): x is string => typeof x === "string") : [];
      const evLabels = (ev.modeLabels && typeof ev.modeLabels === "object" ? ev.modeLabels : {}) as Record<string, unknown>;
      return {
        id: a.id, raisedAtMs: a.raisedAt.getTime(), state: a.state, outcome: a.outcome,
        closedAtMs: a.closedAt ? a.closedAt.getTime() : null, inspectionAtMs: a.inspectionAt ? a.inspectionAt.getTime() : null,
        findings: a.findings, rule: typeof ev.rule === "string" ? ev.rule : null,
        modesBeyond: beyond.map((id) => labels.get(id) ?? (typeof evLabels[id] === "string" ? (evLabels[id] as string) : id)),
      };
    });
}

/** The condition at the end of the period: the stored one for a period up to now, else the replay's timeline then. */
function conditionAt(view: DriftView, asset: Asset, toMs: number, nowMs: number): AssetCondition {
  if (view.skipped || toMs >= nowMs) return asset.condition;
  let state = asset.condition;
  for (const c of view.timeline) if (c.fromMs === null || c.fromMs < toMs) state = c.state;
  return state;
}

/** Gather the report of an asset the actor may read (see the file header). */
export async function getAssetReport(actor: Actor, assetId: string, period: ReportPeriod, opts: { nowMs?: number } = {}): Promise<AssetReport> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  checkPeriod(period);
  const nowMs = opts.nowMs ?? Date.now();
  const [view, org, alerts, rows] = await Promise.all([
    getDriftView(actor, asset.id, { from: period.from, to: period.to }, { nowMs, maxPointsPerMode: 1500 }),
    findOrganisationById(db(), asset.organisationId),
    listAlertsOfOrganisation(db(), asset.organisationId, { assetId: asset.id, limit: 200 }),
    countRows(asset.id, period, asset.expectedIntervalMin),
  ]);
  const base = env().APP_URL.replace(/\/$/, "");
  return {
    generatedAtMs: nowMs, period: { fromMs: period.from.getTime(), toMs: period.to.getTime() },
    organisationName: org?.name ?? "",
    asset: {
      id: asset.id, name: asset.name, kind: asset.kind, material: asset.material, mainDimensionM: asset.mainDimensionM,
      expectedIntervalMin: asset.expectedIntervalMin, condition: conditionAt(view, asset, period.to.getTime(), nowMs),
    },
    baseline: view.baseline ? {
      version: view.baseline.version, trainingFromMs: view.baseline.trainingFrom.getTime(),
      trainingToMs: view.baseline.trainingTo.getTime(), status: view.baseline.status,
    } : null,
    driftSkipped: view.skipped,
    modes: view.modes.map((m) => reportMode(m, rows.identified(m.trackedModeId), rows.availability.accepted)),
    alerts: reportAlerts(alerts, view, period),
    availability: rows.availability,
    caution: REPORT_CAUTION,
    link: `${base}/assets/${asset.id}`,
  };
}
