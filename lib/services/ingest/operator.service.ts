/**
 * Operator tools run from the command line (scripts/cli.ts) by whoever runs the deployment:
 * no signed-in actor. A gateway key is issued on behalf of the organisation (audited with no
 * user); a personal API token is issued to a user in one of their organisations with that
 * membership's role, exactly as the Account screen would.
 */
import { db } from "@/lib/db/knex";
import { findAssetById } from "@/lib/db/repos/asset.repo";
import { insertGateway } from "@/lib/db/repos/gateway.repo";
import { listMembershipsForUser } from "@/lib/db/repos/membership.repo";
import { findUserByEmail } from "@/lib/db/repos/user.repo";
import { GATEWAY_KEY_PREFIX, generateSecret } from "@/lib/auth/tokens";
import type { ApiToken, Gateway } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { createApiToken } from "@/lib/services/accounts/api-token.service";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { isUuid } from "@/lib/services/authz";

/** Create a gateway for the asset; returns its device key once. */
export async function createGatewayAsOperator(input: { assetId: string; name: string }): Promise<{ gateway: Gateway; key: string }> {
  const name = input.name.trim();
  if (name.length < 1 || name.length > 80) throw new AppError("unprocessable", "The gateway name needs 1–80 characters.", { fieldErrors: { name: ["1–80 characters."] } });
  const secret = generateSecret(GATEWAY_KEY_PREFIX);
  return db().transaction(async (trx) => {
    const asset = isUuid(input.assetId) ? await findAssetById(trx, input.assetId) : null;
    if (!asset) throw new AppError("not_found", `No asset ${input.assetId}.`);
    const gateway = await insertGateway(trx, { assetId: asset.id, name, keyHash: secret.hash, keyPrefix: secret.displayPrefix });
    await recordAudit(trx, { organisationId: asset.organisationId, userId: null }, {
      action: "gateway.create", subjectType: "gateway", subjectId: gateway.id,
      details: { assetId: asset.id, name: gateway.name, keyPrefix: gateway.keyPrefix, via: "cli" },
    });
    return { gateway, key: secret.token };
  });
}

/**
 * A personal API token for the user with that e-mail, in organisation `organisationId` (needed
 * only when the user belongs to several). The token carries the membership's role.
 */
export async function createApiTokenAsOperator(input: { email: string; organisationId?: string; name?: string }): Promise<{
  token: string; apiToken: ApiToken; organisationId: string; role: string;
}> {
  const user = await findUserByEmail(db(), input.email.trim().toLowerCase());
  if (!user) throw new AppError("not_found", `No user ${input.email}.`);
  if (user.disabled) throw new AppError("forbidden", `${input.email} is disabled.`);
  const memberships = await listMembershipsForUser(db(), user.id);
  const chosen = input.organisationId ? memberships.find((m) => m.organisationId === input.organisationId) : memberships.length === 1 ? memberships[0] : undefined;
  if (!chosen) {
    const orgs = memberships.map((m) => `${m.organisationId} (${m.organisationName}, ${m.role})`).join("; ");
    throw new AppError("unprocessable", input.organisationId
      ? `${input.email} is not a member of ${input.organisationId}.`
      : `${input.email} belongs to ${memberships.length} organisations: pass --org <id> (${orgs || "none"}).`);
  }
  const out = await createApiToken(
    { userId: user.id, organisationId: chosen.organisationId, role: chosen.role, via: "token" },
    { name: input.name ?? `cli ${new Date().toISOString().slice(0, 16)}` },
  );
  return { ...out, organisationId: chosen.organisationId, role: chosen.role };
}
