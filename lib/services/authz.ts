/**
 * Authorization next to the data (CONVENTIONS §1.2): every service call asserts the actor's
 * role, then that the row belongs to the actor's organisation. A foreign row is reported as
 * missing, so ids of other organisations reveal nothing.
 */
import { can, type Action } from "@/lib/auth/permissions";
import { AppError } from "@/lib/http/errors";
import type { Actor } from "@/lib/domain/types";

export function assertCan(actor: Actor, action: Action): void {
  if (!can(actor.role, action)) {
    throw new AppError("forbidden", "Your role does not allow this.", { details: { action, role: actor.role } });
  }
}

/** Throws not_found unless `row` exists and belongs to the actor's organisation. */
export function assertSameOrg<T extends { organisationId: string }>(
  actor: Actor,
  row: T | null | undefined,
  what = "item",
): asserts row is T {
  if (!row || row.organisationId !== actor.organisationId) {
    throw new AppError("not_found", `No such ${what}.`);
  }
}

/** A well-formed uuid? Ids from URLs that are not uuids answer not_found without a query. */
export function isUuid(v: string): boolean {
  return /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v);
}
