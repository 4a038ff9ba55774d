/**
 * Serviceability values in force for an organisation (issue 6 §3): the recommended values of
 * lib/serviceability with the organisation's overrides (national annex, owner's procedure).
 * Everyone reads; engineers and admins (`settings:write`) set and remove overrides.
 */
import { db } from "@/lib/db/knex";
import { deleteOverride, listOverridesOfOrganisation, upsertOverride } from "@/lib/db/repos/serviceability.repo";
import type { Actor } from "@/lib/domain/types";
import { mergeServiceabilityValues, type ServiceabilityValues } from "@/lib/serviceability/values";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan } from "@/lib/services/authz";
import type { SetOverrideInput } from "./schemas";

/** The merged values of an organisation (no role check: callers assert theirs). */
export async function loadServiceabilityValues(organisationId: string): Promise<ServiceabilityValues> {
  const rows = await listOverridesOfOrganisation(db(), organisationId);
  return mergeServiceabilityValues(Object.fromEntries(rows.map((r) => [r.key, { value: r.value, note: r.note }])));
}

export async function getServiceabilityValues(actor: Actor): Promise<ServiceabilityValues> {
  assertCan(actor, "portfolio:read");
  return loadServiceabilityValues(actor.organisationId);
}

/** Set an override, or remove it when `value` is null. */
export async function setServiceabilityOverride(actor: Actor, input: SetOverrideInput): Promise<ServiceabilityValues> {
  assertCan(actor, "settings:write");
  await db().transaction(async (trx) => {
    if (input.value === null) await deleteOverride(trx, actor.organisationId, input.key);
    else await upsertOverride(trx, actor.organisationId, actor.userId, { key: input.key, value: input.value, note: input.note });
    await recordAudit(trx, actor, {
      action: input.value === null ? "serviceability_override.remove" : "serviceability_override.set",
      subjectType: "organisation", subjectId: actor.organisationId, details: { key: input.key, value: input.value, note: input.note },
    });
  });
  return loadServiceabilityValues(actor.organisationId);
}
