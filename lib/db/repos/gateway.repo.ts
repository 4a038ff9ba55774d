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

/**
 * The live (not revoked) gateway holding a device key, with its asset's organisation, marked
 * seen at `at`: one round trip per device request instead of find + asset + touch.
 */
export async function touchLiveGatewayByKeyHash(
  db: Db, keyHash: string, at: Date,
): Promise<{ gatewayId: string; assetId: string; organisationId: string } | null> {
  const res = await withDbErrors(() => db.raw<{ rows: { id: string; asset_id: string; organisation_id: string }[] }>(
    `update gateways as g set last_seen_at = ? from assets as a
      where g.key_hash = ? and g.revoked_at is null and a.id = g.asset_id
      returning g.id, g.asset_id, a.organisation_id`,
    [at, keyHash],
  ));
  const row = res.rows[0];
  return row ? { gatewayId: row.id, assetId: row.asset_id, organisationId: row.organisation_id } : null;
}
