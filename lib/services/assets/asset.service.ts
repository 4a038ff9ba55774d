/**
 * Assets and their sensor channels. Everyone in the organisation reads; engineers and
 * admins write (`asset:write`, `channel:write`). Every change is audited in its transaction.
 */
import { db, type Db } from "@/lib/db/knex";
import { findAssetById, insertAsset, listAssetsOfOrganisation, updateAssetById } from "@/lib/db/repos/asset.repo";
import {
  findChannelById, insertChannel, listChannelsOfAsset, updateChannelById,
} from "@/lib/db/repos/sensor-channel.repo";
import type { Actor, Asset, AssetListItem, SensorChannel } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan, assertSameOrg, isUuid } from "@/lib/services/authz";
import type { ChannelInput, CreateAssetInput, UpdateAssetInput, UpdateChannelInput } from "./schemas";

const DEFAULT_INTERVAL_MIN = 60;
const DEFAULT_UNITS = { acceleration: "m/s2", force: "N" } as const;

/** Load an asset of the actor's organisation or throw not_found (no role check: callers do it). */
export async function loadOwnAsset(actor: Actor, assetId: string, q: Db = db()): Promise<Asset> {
  const asset = isUuid(assetId) ? await findAssetById(q, assetId) : null;
  assertSameOrg(actor, asset, "asset");
  return asset;
}

/** The organisation's assets by name, with active channel and open alert counts. */
export async function listAssets(actor: Actor): Promise<AssetListItem[]> {
  assertCan(actor, "portfolio:read");
  return listAssetsOfOrganisation(db(), actor.organisationId);
}

export async function getAsset(actor: Actor, assetId: string): Promise<Asset> {
  assertCan(actor, "portfolio:read");
  return loadOwnAsset(actor, assetId);
}

export async function createAsset(actor: Actor, input: CreateAssetInput): Promise<Asset> {
  assertCan(actor, "asset:write");
  return db().transaction(async (trx) => {
    const asset = await insertAsset(trx, actor.organisationId, {
      name: input.name,
      kind: input.kind,
      latitude: input.latitude,
      longitude: input.longitude,
      material: input.material ?? null,
      mainDimensionM: input.mainDimensionM ?? null,
      expectedIntervalMin: input.expectedIntervalMin ?? DEFAULT_INTERVAL_MIN,
      condition: "commissioning",
    });
    await recordAudit(trx, actor, {
      action: "asset.create", subjectType: "asset", subjectId: asset.id, details: { name: asset.name, kind: asset.kind },
    });
    return asset;
  });
}

export async function updateAsset(actor: Actor, assetId: string, input: UpdateAssetInput): Promise<Asset> {
  assertCan(actor, "asset:write");
  return db().transaction(async (trx) => {
    const before = await loadOwnAsset(actor, assetId, trx);
    const changed = changedFields(before, input);
    if (changed.length === 0) return before;
    const after = await updateAssetById(trx, before.id, input);
    if (!after) throw new AppError("not_found", "No such asset.");
    await recordAudit(trx, actor, {
      action: "asset.update", subjectType: "asset", subjectId: after.id, details: { fields: changed },
    });
    return after;
  });
}

/** Names of the fields whose value differs (for the audit entry). */
function changedFields<T extends object>(before: T, patch: Partial<T>): string[] {
  return (Object.keys(patch) as (keyof T)[])
    .filter((k) => patch[k] !== undefined && JSON.stringify(patch[k]) !== JSON.stringify(before[k]))
    .map(String);
}

export async function listChannels(actor: Actor, assetId: string): Promise<SensorChannel[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  return listChannelsOfAsset(db(), asset.id);
}

export async function addChannel(actor: Actor, assetId: string, input: ChannelInput): Promise<SensorChannel> {
  assertCan(actor, "channel:write");
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    const quantity = input.quantity ?? "acceleration";
    const channel = await insertChannel(trx, asset.id, {
      code: input.code,
      positionM: input.positionM,
      direction: input.direction,
      quantity,
      units: input.units ?? DEFAULT_UNITS[quantity],
      sensitivity: input.sensitivity ?? null,
      active: input.active ?? true,
    });
    await recordAudit(trx, actor, {
      action: "channel.create", subjectType: "sensor_channel", subjectId: channel.id,
      details: { assetId: asset.id, code: channel.code },
    });
    return channel;
  });
}

async function loadOwnChannel(actor: Actor, assetId: string, channelId: string, trx: Db): Promise<SensorChannel> {
  const asset = await loadOwnAsset(actor, assetId, trx);
  const channel = isUuid(channelId) ? await findChannelById(trx, channelId) : null;
  if (!channel || channel.assetId !== asset.id) throw new AppError("not_found", "No such channel.");
  return channel;
}

export async function updateChannel(
  actor: Actor, assetId: string, channelId: string, input: UpdateChannelInput,
): Promise<SensorChannel> {
  assertCan(actor, "channel:write");
  return db().transaction(async (trx) => {
    const before = await loadOwnChannel(actor, assetId, channelId, trx);
    const changed = changedFields(before, input);
    if (changed.length === 0) return before;
    const after = await updateChannelById(trx, before.id, input);
    if (!after) throw new AppError("not_found", "No such channel.");
    await recordAudit(trx, actor, {
      action: "channel.update", subjectType: "sensor_channel", subjectId: after.id,
      details: { assetId: after.assetId, code: after.code, fields: changed },
    });
    return after;
  });
}

/** Deactivate (never delete: records refer to channel codes). Idempotent. */
export async function deactivateChannel(actor: Actor, assetId: string, channelId: string): Promise<SensorChannel> {
  return updateChannel(actor, assetId, channelId, { active: false });
}
