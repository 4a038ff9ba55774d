import type { Db } from "@/lib/db/knex";
import { fromAssetPatch, toAsset, type AssetRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Asset, AssetListItem } from "@/lib/domain/types";

const COLS = [
  "id", "organisation_id", "name", "kind", "latitude", "longitude", "material", "main_dimension_m",
  "expected_interval_min", "condition", "created_at", "updated_at",
] as const;

export type AssetWrite = Omit<Asset, "id" | "organisationId" | "createdAt" | "updatedAt" | "condition"> & {
  condition?: Asset["condition"];
};

/** Assets of one organisation by name, with their active channel counts. */
export async function listAssetsOfOrganisation(db: Db, organisationId: string): Promise<AssetListItem[]> {
  const rows = await withDbErrors(() =>
    db("assets as a")
      .select(COLS.map((c) => `a.${c}`))
      .select(
        db.raw(
          "(select count(*)::int from sensor_channels c where c.asset_id = a.id and c.active) as channel_count",
        ),
      )
      .select(db.raw("(select count(*)::int from alerts al where al.asset_id = a.id and al.state <> 'closed') as open_alert_count"))
      .where("a.organisation_id", organisationId)
      .orderBy([{ column: "a.name" }, { column: "a.id" }]),
  );
  return (rows as (AssetRow & { channel_count: number; open_alert_count: number })[]).map((r) => ({
    ...toAsset(r), channelCount: r.channel_count, openAlertCount: r.open_alert_count,
  }));
}

export async function findAssetById(db: Db, id: string): Promise<Asset | null> {
  const row = await withDbErrors(() => db<AssetRow>("assets").select(...COLS).where({ id }).first());
  return row ? toAsset(row) : null;
}

export async function insertAsset(db: Db, organisationId: string, a: AssetWrite & { id?: string }): Promise<Asset> {
  const [row] = await withDbErrors(() =>
    db("assets")
      .insert({ ...(a.id ? { id: a.id } : {}), organisation_id: organisationId, ...fromAssetPatch(a) })
      .returning(COLS),
  );
  return toAsset(row as AssetRow);
}

export async function updateAssetById(db: Db, id: string, patch: Partial<AssetWrite>): Promise<Asset | null> {
  const [row] = await withDbErrors(() =>
    db("assets").where({ id }).update({ ...fromAssetPatch(patch), updated_at: db.fn.now() }).returning(COLS),
  );
  return row ? toAsset(row as AssetRow) : null;
}
