import type { Db } from "@/lib/db/knex";
import { fromChannelPatch, toSensorChannel, type SensorChannelRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { SensorChannel } from "@/lib/domain/types";

const COLS = [
  "id", "asset_id", "code", "position_x_m", "position_y_m", "position_z_m", "direction", "quantity", "units",
  "sensitivity", "active",
] as const;

export type ChannelWrite = Omit<SensorChannel, "id" | "assetId">;

/** Channels of an asset: active ones first, then by code. */
export async function listChannelsOfAsset(db: Db, assetId: string): Promise<SensorChannel[]> {
  const rows = await withDbErrors(() =>
    db<SensorChannelRow>("sensor_channels")
      .select(...COLS)
      .where({ asset_id: assetId })
      .orderBy([{ column: "active", order: "desc" }, { column: "code" }]),
  );
  return rows.map(toSensorChannel);
}

export async function findChannelById(db: Db, id: string): Promise<SensorChannel | null> {
  const row = await withDbErrors(() => db<SensorChannelRow>("sensor_channels").select(...COLS).where({ id }).first());
  return row ? toSensorChannel(row) : null;
}

export async function insertChannel(db: Db, assetId: string, c: ChannelWrite & { id?: string }): Promise<SensorChannel> {
  const [row] = await withDbErrors(() =>
    db("sensor_channels")
      .insert({ ...(c.id ? { id: c.id } : {}), asset_id: assetId, ...fromChannelPatch(c) })
      .returning(COLS),
  );
  return toSensorChannel(row as SensorChannelRow);
}

export async function updateChannelById(db: Db, id: string, patch: Partial<ChannelWrite>): Promise<SensorChannel | null> {
  const [row] = await withDbErrors(() =>
    db("sensor_channels").where({ id }).update({ ...fromChannelPatch(patch), updated_at: db.fn.now() }).returning(COLS),
  );
  return row ? toSensorChannel(row as SensorChannelRow) : null;
}
