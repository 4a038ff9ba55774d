/**
 * An asset's serviceability view (issue 6 §5): measured modes, damping and response levels
 * set against the code and guidance values in force for the organisation. An indication
 * from monitoring data, never a code verification (the page and panel say so).
 * Everyone reads; engineers and admins (`settings:write`) set the per-asset inputs.
 */
import { db } from "@/lib/db/knex";
import { listDesignModesOfAsset } from "@/lib/db/repos/design-mode.repo";
import {
  findAssetServiceabilitySettings, listModeObservations, listRecordLevels, upsertAssetServiceabilitySettings,
} from "@/lib/db/repos/serviceability.repo";
import { listChannelsOfAsset } from "@/lib/db/repos/sensor-channel.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { Actor } from "@/lib/domain/types";
import { assessServiceability, type ServiceabilityAssessment } from "@/lib/serviceability/assess";
import { compareDesignModes } from "@/lib/serviceability/design-compare";
import type { AssetServiceabilitySettings } from "@/lib/serviceability/types";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan } from "@/lib/services/authz";
import { loadServiceabilityValues } from "./overrides.service";
import type { AssetServiceabilityInput } from "./schemas";

const DAY_MS = 86_400_000;

export interface ServiceabilityView extends ServiceabilityAssessment {
  assetId: string;
  assetKind: string;
  periodDays: number;
  fromMs: number;
  toMs: number;
  settings: AssetServiceabilitySettings;
}

/** The view over the last `days` days (30 by default) up to `now`. */
export async function getServiceabilityView(actor: Actor, assetId: string, opts: { days?: number; now?: Date } = {}): Promise<ServiceabilityView> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const periodDays = opts.days ?? 30;
  const to = new Date((opts.now ?? new Date()).getTime() + 1);
  const from = new Date(to.getTime() - periodDays * DAY_MS);
  const [values, settings, channels, tracked, design, observations, records] = await Promise.all([
    loadServiceabilityValues(actor.organisationId),
    findAssetServiceabilitySettings(db(), asset.id),
    listChannelsOfAsset(db(), asset.id),
    listTrackedModesOfAsset(db(), asset.id),
    listDesignModesOfAsset(db(), asset.id),
    listModeObservations(db(), asset.id, from, to),
    listRecordLevels(db(), asset.id, from, to),
  ]);
  // A direction the engineer gave a design mode carries over to its linked or matched tracked mode.
  const pairs = compareDesignModes(design, tracked.map((t) => ({ id: t.id, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz, frequenciesHz: [], shape: null })));
  const designDirection = new Map<string, (typeof design)[number]["direction"]>();
  for (const p of pairs) {
    const d = p.design && design.find((x) => x.id === p.design?.id);
    if (p.tracked && d?.direction) designDirection.set(p.tracked.id, d.direction);
  }
  const assessment = assessServiceability({
    kind: asset.kind, material: asset.material, values,
    channelDirections: Object.fromEntries(channels.map((c) => [c.code, c.direction])),
    modes: tracked.map((t) => ({
      id: t.id, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz, referenceShape: t.referenceShape, designDirection: designDirection.get(t.id) ?? null,
    })),
    observations,
    records: records.map((r) => ({ recordId: r.recordId, atMs: r.startedAt.getTime(), windSpeedMps: r.windSpeedMps, levels: r.levels, channelsUsed: r.channelsUsed })),
    sectionWidthM: settings.sectionWidthM, dampingGuidanceKey: settings.dampingGuidanceKey,
  });
  return { ...assessment, assetId: asset.id, assetKind: asset.kind, periodDays, fromMs: from.getTime(), toMs: to.getTime(), settings };
}

/** Set the asset's section width and damping guidance row (engineers, admins). */
export async function updateAssetServiceabilitySettings(actor: Actor, assetId: string, input: AssetServiceabilityInput): Promise<AssetServiceabilitySettings> {
  assertCan(actor, "settings:write");
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    const settings: AssetServiceabilitySettings = { assetId: asset.id, sectionWidthM: input.sectionWidthM, dampingGuidanceKey: input.dampingGuidanceKey };
    await upsertAssetServiceabilitySettings(trx, actor.userId, settings);
    await recordAudit(trx, actor, { action: "asset.serviceability_settings", subjectType: "asset", subjectId: asset.id, details: { ...input } });
    return settings;
  });
}
