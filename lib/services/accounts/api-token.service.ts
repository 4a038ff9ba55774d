/**
 * Personal API tokens (`Authorization: Bearer mw_pat_…`) for scripts: each acts as its
 * owner in the organisation it was created in, with the owner's current role there.
 * Stored as SHA-256 only; the token is shown once.
 */
import { db } from "@/lib/db/knex";
import {
  findApiTokenByHash, findApiTokenById, insertApiToken, listApiTokensOfUser, revokeApiTokenById, touchApiToken,
} from "@/lib/db/repos/api-token.repo";
import { PERSONAL_TOKEN_PREFIX, generateSecret, hashSecret } from "@/lib/auth/tokens";
import type { Actor, ApiToken } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan, isUuid } from "@/lib/services/authz";
import { resolveActor } from "./account.service";
import type { CreateApiTokenInput, RevokeApiTokenInput } from "./schemas";

/** last_used_at is refreshed at most this often (a write per request would be wasteful). */
const TOUCH_EVERY_MS = 60_000;

export async function createApiToken(actor: Actor, input: CreateApiTokenInput): Promise<{ token: string; apiToken: ApiToken }> {
  assertCan(actor, "token:own");
  const secret = generateSecret(PERSONAL_TOKEN_PREFIX);
  return db().transaction(async (trx) => {
    const rec = await insertApiToken(trx, {
      userId: actor.userId, organisationId: actor.organisationId, name: input.name, tokenHash: secret.hash,
      prefix: secret.displayPrefix,
    });
    await recordAudit(trx, actor, {
      action: "api_token.create", subjectType: "api_token", subjectId: rec.id, details: { name: rec.name, prefix: rec.prefix },
    });
    const { userId: _u, organisationId: _o, ...apiToken } = rec;
    return { token: secret.token, apiToken };
  });
}

/** The actor's own tokens in the current organisation (revoked ones too), newest first. */
export async function listApiTokens(actor: Actor): Promise<ApiToken[]> {
  assertCan(actor, "token:own");
  return listApiTokensOfUser(db(), actor.userId, actor.organisationId);
}

export async function revokeApiToken(actor: Actor, input: RevokeApiTokenInput): Promise<ApiToken> {
  assertCan(actor, "token:own");
  return db().transaction(async (trx) => {
    const rec = isUuid(input.id) ? await findApiTokenById(trx, input.id) : null;
    if (!rec || rec.userId !== actor.userId || rec.organisationId !== actor.organisationId) {
      throw new AppError("not_found", "No such token.");
    }
    const revoked = rec.revokedAt ? rec : await revokeApiTokenById(trx, rec.id);
    if (!revoked) throw new AppError("not_found", "No such token.");
    if (!rec.revokedAt) {
      await recordAudit(trx, actor, {
        action: "api_token.revoke", subjectType: "api_token", subjectId: rec.id, details: { name: rec.name, prefix: rec.prefix },
      });
    }
    const { userId: _u, organisationId: _o, ...apiToken } = revoked;
    return apiToken;
  });
}

/**
 * The actor a personal token stands for, or null (unknown, revoked, not a personal token,
 * owner disabled or no longer a member). Gateway keys are not personal tokens: null.
 */
export async function actorFromApiToken(bearer: string): Promise<Actor | null> {
  if (!bearer.startsWith(PERSONAL_TOKEN_PREFIX)) return null;
  const rec = await findApiTokenByHash(db(), hashSecret(bearer));
  if (!rec || rec.revokedAt) return null;
  const actor = await resolveActor(rec.userId, rec.organisationId, "token");
  if (!actor) return null;
  const now = new Date();
  if (!rec.lastUsedAt || now.getTime() - rec.lastUsedAt.getTime() > TOUCH_EVERY_MS) {
    await touchApiToken(db(), rec.id, now);
  }
  return actor;
}
