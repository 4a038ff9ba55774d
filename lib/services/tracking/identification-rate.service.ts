/**
 * Identification rate of each tracked mode over a period (Analysis screen): of the asset's
 * analysed records that started in the period and whose current result sought the mode, the
 * share where a mode was assigned to it; plus how many identified modes went unassigned.
 * A mode added after records were analysed was not sought in them: the rate counts only the
 * records that sought it, and `notSought` says how many were analysed without it.
 */
import { db } from "@/lib/db/knex";
import { countModeIdentificationsInPeriod, summariseIdentificationsInPeriod } from "@/lib/db/repos/identification-rate.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { TrackedMode } from "@/lib/domain/records";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan } from "@/lib/services/authz";

/** Default period of the rates: the last 30 days [practice: a month spans several weather spells]. */
export const DEFAULT_RATE_PERIOD_DAYS = 30;

export interface TrackedModeRate extends TrackedMode {
  sought: number;
  identified: number;
  /** identified / sought, or null when no record of the period sought the mode. */
  rate: number | null;
  /** Analysed records of the period whose current result did not seek the mode. */
  notSought: number;
  lastIdentifiedAt: Date | null;
}

export interface IdentificationRates {
  from: Date;
  to: Date;
  analysedRecords: number;
  unassignedModes: number;
  recordsWithUnassigned: number;
  /** Every tracked mode of the asset (inactive ones too), ascending in nominal frequency. */
  modes: TrackedModeRate[];
}

/** Rates of the asset's tracked modes over records that started in [from, to). */
export async function getIdentificationRates(actor: Actor, assetId: string, period: { from: Date; to: Date }): Promise<IdentificationRates> {
  assertCan(actor, "portfolio:read");
  if (!(period.from < period.to)) {
    throw new AppError("unprocessable", "The period's end must be after its start.", { fieldErrors: { to: ["The period's end must be after its start."] } });
  }
  const asset = await loadOwnAsset(actor, assetId);
  const [modes, counts, summary] = await Promise.all([
    listTrackedModesOfAsset(db(), asset.id, { includeInactive: true }),
    countModeIdentificationsInPeriod(db(), asset.id, period.from, period.to),
    summariseIdentificationsInPeriod(db(), asset.id, period.from, period.to),
  ]);
  const byId = new Map(counts.map((c) => [c.trackedModeId, c]));
  return {
    ...period, ...summary,
    modes: modes.map((m) => {
      const c = byId.get(m.id);
      const sought = c?.sought ?? 0;
      const identified = c?.identified ?? 0;
      return {
        ...m, sought, identified, rate: sought ? identified / sought : null,
        notSought: Math.max(0, summary.analysedRecords - sought), lastIdentifiedAt: c?.lastIdentifiedAt ?? null,
      };
    }),
  };
}
