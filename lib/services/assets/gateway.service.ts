/**
 * Gateways of an asset. Everyone reads the list (names, key prefixes, last seen); only
 * admins create and revoke (`gateway:write`). The device key is shown once, at creation.
 */
import { db } from "@/lib/db/knex";
import {
  findGatewayById, insertGateway, listGatewaysOfAsset, revokeGatewayById, touchLiveGatewayByKeyHash,
} from "@/lib/db/repos/gateway.repo";
import { GATEWAY_KEY_PREFIX, generateSecret, hashSecret } from "@/lib/auth/tokens";
import type { Actor, Gateway } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan, isUuid } from "@/lib/services/authz";
import { loadOwnAsset } from "./asset.service";
import type { CreateGatewayInput } from "./schemas";

export async function listGateways(actor: Actor, assetId: string): Promise<Gateway[]> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  return listGatewaysOfAsset(db(), asset.id);
}

/** Create a gateway; returns its device key (`mw_gw_…`) once. Only the key's SHA-256 is stored. */
export async function createGateway(
  actor: Actor, assetId: string, input: CreateGatewayInput,
): Promise<{ gateway: Gateway; key: string }> {
  assertCan(actor, "gateway:write");
  const secret = generateSecret(GATEWAY_KEY_PREFIX);
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    const gateway = await insertGateway(trx, {
      assetId: asset.id, name: input.name, keyHash: secret.hash, keyPrefix: secret.displayPrefix,
    });
    await recordAudit(trx, actor, {
      action: "gateway.create", subjectType: "gateway", subjectId: gateway.id,
      details: { assetId: asset.id, name: gateway.name, keyPrefix: gateway.keyPrefix },
    });
    return { gateway, key: secret.token };
  });
}

/** Revoke a gateway's key for good (idempotent: the first revocation time is kept). */
export async function revokeGateway(actor: Actor, assetId: string, gatewayId: string): Promise<Gateway> {
  assertCan(actor, "gateway:write");
  return db().transaction(async (trx) => {
    const asset = await loadOwnAsset(actor, assetId, trx);
    const existing = isUuid(gatewayId) ? await findGatewayById(trx, gatewayId) : null;
    if (!existing || existing.assetId !== asset.id) throw new AppError("not_found", "No such gateway.");
    if (existing.revokedAt) return existing;
    const gateway = await revokeGatewayById(trx, existing.id);
    if (!gateway) throw new AppError("not_found", "No such gateway.");
    await recordAudit(trx, actor, {
      action: "gateway.revoke", subjectType: "gateway", subjectId: gateway.id,
      details: { assetId: asset.id, name: gateway.name, keyPrefix: gateway.keyPrefix },
    });
    return gateway;
  });
}

/** A gateway acting with its device key: the asset it may upload to, nothing else. */
export interface DeviceActor {
  gatewayId: string;
  assetId: string;
  organisationId: string;
}

/**
 * The gateway a device key (`mw_gw_…`) belongs to, or null (unknown, revoked, or not a
 * device key). Marks the gateway as seen.
 */
export async function deviceFromGatewayKey(bearer: string): Promise<DeviceActor | null> {
  if (!bearer.startsWith(GATEWAY_KEY_PREFIX)) return null;
  return touchLiveGatewayByKeyHash(db(), hashSecret(bearer), new Date());
}
