import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

/** Ids of the assets `userId` muted (alert e-mails off). */
export async function listMutedAssetIds(db: Db, userId: string): Promise<string[]> {
  const rows = await withDbErrors(() =>
    db("notification_preferences").select("asset_id").where({ user_id: userId, muted: true }),
  );
  return (rows as { asset_id: string }[]).map((r) => r.asset_id);
}

/** Ids of the users who muted `assetId`. */
export async function listUsersMutingAsset(db: Db, assetId: string): Promise<string[]> {
  const rows = await withDbErrors(() =>
    db("notification_preferences").select("user_id").where({ asset_id: assetId, muted: true }),
  );
  return (rows as { user_id: string }[]).map((r) => r.user_id);
}

/** Set muted on/off for several assets of one user (upsert per asset). */
export async function upsertMutedAssets(db: Db, userId: string, prefs: { assetId: string; muted: boolean }[]): Promise<void> {
  if (prefs.length === 0) return;
  await withDbErrors(() =>
    db("notification_preferences")
      .insert(prefs.map((p) => ({ user_id: userId, asset_id: p.assetId, muted: p.muted, updated_at: db.fn.now() })))
      .onConflict(["user_id", "asset_id"]).merge(["muted", "updated_at"]),
  );
}
