/**
 * Alert e-mail opt-out per asset (Account page): each member may mute assets of the current
 * organisation; a muted asset sends that member no alert e-mails (raise, assignment, closure).
 * The alert and drift services filter their recipients with `withoutMutedRecipients`.
 */
import { z } from "zod";
import { db, type Db } from "@/lib/db/knex";
import { listAssetsOfOrganisation } from "@/lib/db/repos/asset.repo";
import { listMutedAssetIds, listUsersMutingAsset, upsertMutedAssets } from "@/lib/db/repos/notification-pref.repo";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan } from "@/lib/services/authz";

/** Form input: the ids of the assets to mute (checked boxes); every other asset is unmuted. */
export const UpdateNotificationPrefsInput = z.object({
  muted: z.preprocess((v) => (v === undefined || v === "" ? [] : Array.isArray(v) ? v : [v]), z.array(z.uuid("Unknown asset."))),
});
export type UpdateNotificationPrefsInput = z.infer<typeof UpdateNotificationPrefsInput>;

export interface AssetNotificationPref { assetId: string; assetName: string; muted: boolean }

/** The organisation's assets by name with the actor's muted flag. */
export async function listNotificationPrefs(actor: Actor): Promise<AssetNotificationPref[]> {
  assertCan(actor, "portfolio:read");
  const [assets, muted] = await Promise.all([listAssetsOfOrganisation(db(), actor.organisationId), listMutedAssetIds(db(), actor.userId)]);
  const set = new Set(muted);
  return assets.map((a) => ({ assetId: a.id, assetName: a.name, muted: set.has(a.id) }));
}

/** Mute exactly the listed assets of the organisation (others unmuted); audited. */
export async function updateNotificationPrefs(actor: Actor, input: UpdateNotificationPrefsInput): Promise<AssetNotificationPref[]> {
  assertCan(actor, "portfolio:read");
  const assets = await listAssetsOfOrganisation(db(), actor.organisationId);
  const known = new Set(assets.map((a) => a.id));
  const unknown = input.muted.filter((id) => !known.has(id));
  if (unknown.length > 0) throw new AppError("unprocessable", "Unknown asset.", { fieldErrors: { muted: ["Unknown asset."] } });
  const muted = new Set(input.muted);
  await db().transaction(async (trx) => {
    await upsertMutedAssets(trx, actor.userId, assets.map((a) => ({ assetId: a.id, muted: muted.has(a.id) })));
    await recordAudit(trx, actor, {
      action: "account.notifications", subjectType: "user", subjectId: actor.userId, details: { mutedAssetIds: [...muted] },
    });
  });
  return assets.map((a) => ({ assetId: a.id, assetName: a.name, muted: muted.has(a.id) }));
}

/** The recipients minus the users who muted `assetId`. */
export async function withoutMutedRecipients<R extends { userId: string }>(q: Db, assetId: string, recipients: R[]): Promise<R[]> {
  if (recipients.length === 0) return recipients;
  const muting = new Set(await listUsersMutingAsset(q, assetId));
  return recipients.filter((r) => !muting.has(r.userId));
}
