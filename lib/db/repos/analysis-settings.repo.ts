import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import { toAnalysisSettings, type AnalysisSettingsRow } from "@/lib/db/rows-records";
import type { AnalysisSettings, AnalysisSettingsValues } from "@/lib/domain/records";

const COLS = ["id", "asset_id", "version", "settings", "created_by_user_id", "created_at"] as const;

/** The newest settings version of an asset, or null when none was saved. */
export async function findLatestAnalysisSettings(db: Db, assetId: string): Promise<AnalysisSettings | null> {
  const row = await withDbErrors(() =>
    db<AnalysisSettingsRow>("analysis_settings").select(...COLS).where({ asset_id: assetId }).orderBy("version", "desc").first(),
  );
  return row ? toAnalysisSettings(row) : null;
}

export async function findAnalysisSettingsVersion(db: Db, assetId: string, version: number): Promise<AnalysisSettings | null> {
  const row = await withDbErrors(() =>
    db<AnalysisSettingsRow>("analysis_settings").select(...COLS).where({ asset_id: assetId, version }).first(),
  );
  return row ? toAnalysisSettings(row) : null;
}

/**
 * Add a settings version (next after the newest). Concurrent writers collide on the unique
 * (asset, version) key: the loser gets AppError('conflict').
 */
export async function insertAnalysisSettingsVersion(
  db: Db, assetId: string, settings: AnalysisSettingsValues, createdByUserId: string | null,
): Promise<AnalysisSettings> {
  const [row] = await withDbErrors(() =>
    db("analysis_settings")
      .insert({
        asset_id: assetId,
        version: db.raw("coalesce((select max(version) from analysis_settings where asset_id = ?), 0) + 1", [assetId]),
        settings: JSON.stringify(settings),
        created_by_user_id: createdByUserId,
      })
      .returning(COLS),
  );
  return toAnalysisSettings(row as AnalysisSettingsRow);
}

/** Version 1 with `settings` if the asset has no settings yet (idempotent under races); returns the newest. */
export async function ensureAnalysisSettings(db: Db, assetId: string, settings: AnalysisSettingsValues): Promise<AnalysisSettings> {
  await withDbErrors(() =>
    db("analysis_settings")
      .insert({ asset_id: assetId, version: 1, settings: JSON.stringify(settings), created_by_user_id: null })
      .onConflict(["asset_id", "version"]).ignore(),
  );
  const latest = await findLatestAnalysisSettings(db, assetId);
  if (!latest) throw new Error(`analysis settings of asset ${assetId} vanished`);
  return latest;
}

export interface AnalysisSettingsVersionRow extends AnalysisSettings {
  /** Display name of the user who saved it (null: created by the system, e.g. version 1). */
  createdByName: string | null;
}

/** The asset's settings versions, newest first, at most `limit`, with who saved each. */
export async function listAnalysisSettingsVersions(db: Db, assetId: string, limit: number): Promise<AnalysisSettingsVersionRow[]> {
  const rows = await withDbErrors(() =>
    db("analysis_settings as s")
      .leftJoin("users as u", "u.id", "s.created_by_user_id")
      .select(...COLS.map((c) => `s.${c}`), "u.display_name as created_by_name")
      .where("s.asset_id", assetId)
      .orderBy("s.version", "desc")
      .limit(limit),
  );
  return (rows as (AnalysisSettingsRow & { created_by_name: string | null })[]).map((r) => ({
    ...toAnalysisSettings(r), createdByName: r.created_by_name,
  }));
}
