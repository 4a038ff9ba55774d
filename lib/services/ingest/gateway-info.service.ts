/**
 * What a gateway may know about itself with its device key: its asset's name and kind, the
 * active sensor channels (codes in the order a record should use, positions, directions) and
 * the tracked modes (so a gateway or the simulator can size records). Nothing of other assets.
 */
import { db } from "@/lib/db/knex";
import { findAssetById } from "@/lib/db/repos/asset.repo";
import { findGatewayById } from "@/lib/db/repos/gateway.repo";
import { listChannelsOfAsset } from "@/lib/db/repos/sensor-channel.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { SensorChannel } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import type { DeviceActor } from "@/lib/services/assets/gateway.service";

export interface GatewaySelf {
  gateway: { id: string; name: string };
  asset: { id: string; name: string; kind: string; mainDimensionM: number | null; expectedIntervalMin: number };
  channels: Pick<SensorChannel, "code" | "positionM" | "direction" | "quantity" | "units">[];
  trackedModes: { label: string; nominalFrequencyHz: number; bandLowHz: number; bandHighHz: number; referenceShape: Record<string, number> | null }[];
}

export async function describeGatewaySelf(device: DeviceActor): Promise<GatewaySelf> {
  const [gateway, asset, channels, tracked] = await Promise.all([
    findGatewayById(db(), device.gatewayId), findAssetById(db(), device.assetId),
    listChannelsOfAsset(db(), device.assetId), listTrackedModesOfAsset(db(), device.assetId),
  ]);
  if (!gateway || !asset) throw new AppError("not_found", "No such gateway.");
  return {
    gateway: { id: gateway.id, name: gateway.name },
    asset: { id: asset.id, name: asset.name, kind: asset.kind, mainDimensionM: asset.mainDimensionM, expectedIntervalMin: asset.expectedIntervalMin },
    channels: channels.filter((c) => c.active).map(({ code, positionM, direction, quantity, units }) => ({ code, positionM, direction, quantity, units })),
    trackedModes: tracked.map(({ label, nominalFrequencyHz, bandLowHz, bandHighHz, referenceShape }) => ({ label, nominalFrequencyHz, bandLowHz, bandHighHz, referenceShape })),
  };
}
