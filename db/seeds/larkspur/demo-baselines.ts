/**
 * Demo baselines: once the year of demo history is in, each Larkspur asset gets a baseline
 * fitted on its first nine months (provisional: less than a full year of seasons) and its
 * drift statistics are replayed, so the portfolio opens with the conditions the history
 * implies — Heron Reach's late stiffness loss raises its alert at the time it would have
 * been raised. Goes through the real services (the same fit, replay and alert e-mails as
 * in production). Idempotent: an asset that has a baseline keeps it; the replay raises no
 * alert twice.
 */
import type { Knex } from "knex";
import type { Actor } from "../../../lib/domain/types";
import { fitAndActivateBaseline } from "../../../lib/services/drift/baseline.service";
import { recomputeDrift } from "../../../lib/services/drift/drift.service";
import { DEMO_ORGANISATION } from "../demo-users";
import { DEMO_ASSETS, DEMO_USER_IDS } from "./data";

const DAY_MS = 86_400_000;
/** Training window: the first 270 days of the 365-day history. */
const TRAINING_DAYS = 270;

export async function seedDemoBaselines(knex: Knex, opts: { now?: Date; historyDays?: number } = {}): Promise<void> {
  const now = opts.now ?? new Date();
  const from = new Date(now.getTime() - (opts.historyDays ?? 365) * DAY_MS);
  const to = new Date(from.getTime() + TRAINING_DAYS * DAY_MS);
  const engineer: Actor = { userId: DEMO_USER_IDS.engineer, organisationId: DEMO_ORGANISATION.id, role: "engineer", via: "session" };
  for (const asset of DEMO_ASSETS) {
    const existing = await knex("baselines").where({ asset_id: asset.id }).first("id");
    if (!existing) await fitAndActivateBaseline(engineer, asset.id, { from, to, model: "auto" });
    await recomputeDrift(asset.id, { nowMs: now.getTime() });
  }
}
