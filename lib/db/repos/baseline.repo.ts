import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { Baseline, BaselineModeModel, BaselineModelChoice, BaselineStatus } from "@/lib/domain/drift";

const COLS = [
  "id", "asset_id", "version", "training_from", "training_to", "status", "requested_model", "models", "created_by", "created_at", "active",
] as const;

interface BaselineRow {
  id: string; asset_id: string; version: number; training_from: Date; training_to: Date; status: BaselineStatus;
  requested_model: BaselineModelChoice; models: BaselineModeModel[]; created_by: string | null; created_at: Date; active: boolean;
}

const toBaseline = (r: BaselineRow): Baseline => ({
  id: r.id, assetId: r.asset_id, version: r.version, trainingFrom: r.training_from, trainingTo: r.training_to, status: r.status,
  requestedModel: r.requested_model, models: r.models, createdByUserId: r.created_by, createdAt: r.created_at, active: r.active,
});

/** Versions of the asset's baseline, newest first. */
export async function listBaselinesOfAsset(db: Db, assetId: string): Promise<Baseline[]> {
  const rows = await withDbErrors(() => db<BaselineRow>("baselines").select(...COLS).where({ asset_id: assetId }).orderBy("version", "desc"));
  return rows.map(toBaseline);
}

export async function findActiveBaseline(db: Db, assetId: string): Promise<Baseline | null> {
  const row = await withDbErrors(() => db<BaselineRow>("baselines").select(...COLS).where({ asset_id: assetId, active: true }).first());
  return row ? toBaseline(row) : null;
}

/**
 * Insert a new version and make it the only active one; the previously active version is
 * marked superseded. Run inside a transaction; locks the asset's baselines first.
 */
export async function insertActiveBaseline(
  db: Db, b: Pick<Baseline, "assetId" | "trainingFrom" | "trainingTo" | "status" | "requestedModel" | "models" | "createdByUserId">,
): Promise<{ baseline: Baseline; superseded: number | null }> {
  await withDbErrors(() => db.raw("select id from assets where id = ? for update", [b.assetId]));
  const [{ max }] = await withDbErrors(() => db("baselines").where({ asset_id: b.assetId }).max<{ max: number | null }[]>({ max: "version" }));
  const prev = await withDbErrors(() => db("baselines").where({ asset_id: b.assetId, active: true }).update({ active: false, status: "superseded" }).returning("version"));
  const [row] = await withDbErrors(() =>
    db("baselines").insert({
      asset_id: b.assetId, version: (max ?? 0) + 1, training_from: b.trainingFrom, training_to: b.trainingTo, status: b.status,
      requested_model: b.requestedModel, models: JSON.stringify(b.models), created_by: b.createdByUserId, active: true,
    }).returning(COLS),
  );
  return { baseline: toBaseline(row as BaselineRow), superseded: prev.length ? (prev[0] as { version: number }).version : null };
}

/** Display names of the users who fitted the asset's baseline versions: baseline id → name. */
export async function listBaselineAuthorNames(db: Db, assetId: string): Promise<Map<string, string>> {
  const rows = await withDbErrors(() =>
    db("baselines as b").join("users as u", "u.id", "b.created_by").where("b.asset_id", assetId).select("b.id", "u.display_name"),
  );
  return new Map((rows as { id: string; display_name: string }[]).map((r) => [r.id, r.display_name]));
}
