/**
 * The Asset Overview (issue 6 §1) and the Portfolio's "needs attention" list (§5): reads for
 * every role (`portfolio:read`), scoped to the actor's organisation (another organisation's
 * asset is not_found). The drift statistics come from getDriftView; this service adds data
 * availability, gateways, open alerts and what changed.
 */
import { db } from "@/lib/db/knex";
import {
  countRecordsPerDay, listChannelDeactivations, listChannelQualityPerDay,
  listGatewayContacts, listOpenAlertsOfAsset, type GatewayContact, type OpenAlertRow,
} from "@/lib/db/repos/overview.repo";
import {
  listAlertChangesSince, listAuditChangesSince, listBaselineVersionsSince, listSettingsVersionsSince,
} from "@/lib/db/repos/overview-changes.repo";
import { listAssetBaselineStates, listChannelIssues, listLiveAlertsOfOrganisation } from "@/lib/db/repos/overview-portfolio.repo";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import { listChannelsOfAsset } from "@/lib/db/repos/sensor-channel.repo";
import type { Actor, Asset, SensorChannel } from "@/lib/domain/types";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan } from "@/lib/services/authz";
import { getIdentificationRates } from "@/lib/services/tracking/identification-rate.service";
import { buildAttention, type AttentionItem } from "./attention";
import { buildChanges, type ChangeItem } from "./changes";
import { buildChannelTimeline, localDays, type ChannelTimelineRow } from "./timeline";

const DAY_MS = 86_400_000;
/** Days of data availability shown on the Overview. */
export const AVAILABILITY_DAYS = 30;
/** Window of the "x of y records" count of a data issue, days. */
export const ISSUE_WINDOW_DAYS = 7;
const CHANGES_LIMIT = 100;

/** A tracked mode's identifications over the availability window (from H2's getIdentificationRates). */
export interface IdentificationRate {
  trackedModeId: string;
  label: string;
  nominalFrequencyHz: number;
  active: boolean;
  /** Analysed records of the window whose current result sought the mode. */
  analysed: number;
  /** Of those, how many identified it. */
  identified: number;
}

export interface AssetOverview {
  asset: Asset;
  timeZone: string;
  channels: SensorChannel[];
  gateways: GatewayContact[];
  openAlerts: OpenAlertRow[];
  /** Start of the newest analysed record (accepted), null when none. */
  lastAcceptedAt: Date | null;
  availability: {
    /** Local calendar days shown, oldest first (YYYY-MM-DD). */
    days: string[];
    /** Records per day aligned with `days`. */
    recordsPerDay: { day: string; total: number; analysed: number; rejected: number; failed: number }[];
    /** Records a day the expected interval implies. */
    expectedPerDay: number;
    identification: IdentificationRate[];
    channels: ChannelTimelineRow[];
  };
}

async function timeZoneOf(actor: Actor): Promise<string> {
  return (await findOrganisationById(db(), actor.organisationId))?.timeZone ?? "UTC";
}

/** Everything on the Overview except the drift statistics and the changes list. */
export async function getAssetOverview(actor: Actor, assetId: string, opts: { now?: Date } = {}): Promise<AssetOverview> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const now = opts.now ?? new Date();
  const timeZone = await timeZoneOf(actor);
  const days = localDays(now, AVAILABILITY_DAYS, timeZone);
  const w = { from: new Date(now.getTime() - AVAILABILITY_DAYS * DAY_MS), to: now, timeZone };
  const [channels, gateways, openAlerts, perDay, identification, quality, deactivations, states] = await Promise.all([
    listChannelsOfAsset(db(), asset.id),
    listGatewayContacts(db(), asset.id),
    listOpenAlertsOfAsset(db(), asset.id),
    countRecordsPerDay(db(), asset.id, w),
    getIdentificationRates(actor, asset.id, { from: w.from, to: w.to }),
    listChannelQualityPerDay(db(), asset.id, w),
    listChannelDeactivations(db(), asset.id),
    listAssetBaselineStates(db(), actor.organisationId),
  ]);
  const byDay = new Map(perDay.map((r) => [r.day, r]));
  return {
    asset, timeZone, channels, gateways, openAlerts,
    lastAcceptedAt: states.find((s) => s.assetId === asset.id)?.lastAnalysedAt ?? null,
    availability: {
      days,
      recordsPerDay: days.map((d) => byDay.get(d) ?? { day: d, total: 0, analysed: 0, rejected: 0, failed: 0 }),
      expectedPerDay: 1440 / asset.expectedIntervalMin,
      identification: identification.modes
        .map((m) => ({ trackedModeId: m.id, label: m.label, nominalFrequencyHz: m.nominalFrequencyHz, active: m.active, analysed: m.sought, identified: m.identified }))
        .sort((a, b) => Number(b.active) - Number(a.active)),
      channels: buildChannelTimeline(days, channels, quality, deactivations, timeZone),
    },
  };
}

/** What changed on the asset since `since` (baselines, settings, channels, modes, gateways, alerts), newest first. */
export async function getAssetChanges(actor: Actor, assetId: string, since: Date): Promise<ChangeItem[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const [baselines, settings, alerts, audit] = await Promise.all([
    listBaselineVersionsSince(db(), asset.id, since, CHANGES_LIMIT),
    listSettingsVersionsSince(db(), asset.id, since, CHANGES_LIMIT),
    listAlertChangesSince(db(), asset.id, since, CHANGES_LIMIT),
    listAuditChangesSince(db(), actor.organisationId, asset.id, since, CHANGES_LIMIT),
  ]);
  return buildChanges({ baselines, settings, alerts, audit }, asset.id).slice(0, CHANGES_LIMIT);
}

/** The Portfolio's "needs attention" list for the actor's organisation. */
export async function getNeedsAttention(actor: Actor, opts: { now?: Date } = {}): Promise<AttentionItem[]> {
  assertCan(actor, "portfolio:read");
  const now = opts.now ?? new Date();
  const [alerts, assets, channelIssues] = await Promise.all([
    listLiveAlertsOfOrganisation(db(), actor.organisationId),
    listAssetBaselineStates(db(), actor.organisationId),
    listChannelIssues(db(), actor.organisationId, ISSUE_WINDOW_DAYS, now),
  ]);
  return buildAttention({ alerts, assets, channelIssues, recentDays: ISSUE_WINDOW_DAYS, now });
}
