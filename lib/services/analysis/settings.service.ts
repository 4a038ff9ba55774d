/**
 * Analysis settings of an asset (issue 4 §4): everyone reads them, engineers and admins change
 * them (`settings:write`). A change never edits a version: it adds the next one, and results
 * keep the version they were computed with. Reprocessing (reprocess.service.ts) applies it.
 */
import { db } from "@/lib/db/knex";
import {
  ensureAnalysisSettings, insertAnalysisSettingsVersion, listAnalysisSettingsVersions,
} from "@/lib/db/repos/analysis-settings.repo";
import type { AnalysisSettings } from "@/lib/domain/records";
import type { Actor } from "@/lib/domain/types";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan } from "@/lib/services/authz";
import { formValuesOf, settingsValuesOf, type UpdateAnalysisSettingsInput } from "./schemas";
import { DEFAULT_ANALYSIS_SETTINGS } from "./settings";

export interface AnalysisSettingsView extends AnalysisSettings {
  /** The same values as flat form fields (what UpdateAnalysisSettingsInput accepts). */
  form: UpdateAnalysisSettingsInput;
}

const viewOf = (s: AnalysisSettings): AnalysisSettingsView => ({ ...s, form: formValuesOf(s.settings) });

/** The asset's current settings (version 1 with the defaults is created on first read). */
export async function getAnalysisSettings(actor: Actor, assetId: string): Promise<AnalysisSettingsView> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  return viewOf(await ensureAnalysisSettings(db(), asset.id, DEFAULT_ANALYSIS_SETTINGS));
}

/** Versions shown on the Analysis screen [practice: enough to see a season of changes]. */
export const SETTINGS_HISTORY_LIMIT = 20;

export interface AnalysisSettingsVersionView extends AnalysisSettingsView {
  /** Who saved it (null: the system's version 1 with the defaults). */
  createdByName: string | null;
}

/**
 * The asset's settings versions, newest (the current one) first, at most
 * SETTINGS_HISTORY_LIMIT, with who saved each; version 1 is created on first read.
 */
export async function listAnalysisSettingsHistory(actor: Actor, assetId: string): Promise<AnalysisSettingsVersionView[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  await ensureAnalysisSettings(db(), asset.id, DEFAULT_ANALYSIS_SETTINGS);
  const rows = await listAnalysisSettingsVersions(db(), asset.id, SETTINGS_HISTORY_LIMIT);
  return rows.map((r) => ({ ...viewOf(r), createdByName: r.createdByName }));
}

/** Save new settings as the next version (audited); returns it. Concurrent saves: one gets 'conflict'. */
export async function updateAnalysisSettings(
  actor: Actor, assetId: string, input: UpdateAnalysisSettingsInput,
): Promise<AnalysisSettingsView> {
  assertCan(actor, "settings:write");
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    const previous = await ensureAnalysisSettings(trx, asset.id, DEFAULT_ANALYSIS_SETTINGS);
    const saved = await insertAnalysisSettingsVersion(trx, asset.id, settingsValuesOf(input), actor.userId);
    await recordAudit(trx, actor, {
      action: "analysis_settings.update", subjectType: "asset", subjectId: asset.id,
      details: { fromVersion: previous.version, version: saved.version, settings: saved.settings },
    });
    return viewOf(saved);
  });
}
