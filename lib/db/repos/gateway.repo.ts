import type { Db } from "@/lib/db/knex";
import { toGateway, type GatewayRow } from "@/lib/db/rows";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Gateway } from "@/lib/domain/types";

const COLS = ["id", "asset_id", "name", "key_prefix", "last_seen_at", "revoked_at", "created_at"] as const;

export async function listGatewaysOfAsset(db: Db, assetId: string): Promise<Gateway[]> {
  const rows = await withDbErrors(() =>
    db<GatewayRow>("gateways").select(...COLS).where({ asset_id: assetId }).orderBy([{ column: "created_at" }, { column: "id" }]),
  );
  return rows.map(toGateway);
}

export async function findGatewayById(db: Db, id: string): Promise<Gateway | null> {
  const row = await withDbErrors(() => db<GatewayRow>("gateways").select(...COLS).where({ id }).first());
  return row ? toGateway(row) : null;
}

/** The gateway holding a device key (by SHA-256), revoked or not; the caller decides. */
export async function findGatewayByKeyHash(db: Db, keyHash: string): Promise<Gateway | null> {
  const row = await withDbErrors(() => db<GatewayRow>("gateways").select(...COLS).where("key_hash", keyHash).first());
  return row ? toGateway(row) : null;
}

export async function insertGateway(
  db: Db,
  g: { id?: string; assetId: string; name: string; keyHash: string; keyPrefix: string },
): Promise<Gateway> {
  const [row] = await withDbErrors(() =>
    db("gateways")
      .insert({ ...(g.id ? { id: g.id } : {}), asset_id: g.assetId, name: g.name, key_hash: g.keyHash, key_prefix: g.keyPrefix })
      .returning(COLS),
  );
  return toGateway(row as GatewayRow);
}

/** Revoke once; revoking again keeps the first time. */
export async function revokeGatewayById(db: Db, id: string): Promise<Gateway | null> {
  const [row] = await withDbErrors(() =>
    db("gateways")
      .where({ id })
      .update({ revoked_at: db.raw("coalesce(revoked_at, now())") })
      .returning(COLS),
  );
  return row ? toGateway(row as GatewayRow) : null;
}

export async function touchGateway(db: Db, id: string, at: Date): Promise<void> {
  await withDbErrors(() => db("gateways").where({ id }).update({ last_seen_at: at }));
}
