/**
 * Domain types shared by services, pages and route handlers. Server-side objects carry
 * `Date`; what crosses to the browser as JSON uses the `…Summary`/`…Json` variants with
 * ISO strings. SI units in storage and in these types (metres, minutes where named).
 */
import type { Role } from "@/lib/auth/permissions";

export type { Role } from "@/lib/auth/permissions";

export const ASSET_KINDS = ["footbridge", "pedestrian_bridge", "tower", "mast", "chimney", "other"] as const;
export type AssetKind = (typeof ASSET_KINDS)[number];

export const ASSET_CONDITIONS = ["commissioning", "steady", "watch", "alert", "silent"] as const;
export type AssetCondition = (typeof ASSET_CONDITIONS)[number];

export const CHANNEL_DIRECTIONS = ["x", "y", "z", "-x", "-y", "-z"] as const;
export type ChannelDirection = (typeof CHANNEL_DIRECTIONS)[number];

export const CHANNEL_QUANTITIES = ["acceleration", "force"] as const;
export type ChannelQuantity = (typeof CHANNEL_QUANTITIES)[number];

/** Who is acting: a signed-in user (session) or a personal API token acting as its owner. */
export interface Actor {
  userId: string;
  organisationId: string;
  role: Role;
  via: "session" | "token";
}

export interface Organisation {
  id: string;
  name: string;
  /** IANA time zone, e.g. "America/Denver"; times are stored in UTC and shown in this zone. */
  timeZone: string;
}

/** One of the current user's organisations (organisation switcher). */
export interface Membership {
  organisationId: string;
  organisationName: string;
  role: Role;
}

/** A member of the actor's organisation (Team screen). */
export interface Member {
  userId: string;
  email: string;
  displayName: string;
  role: Role;
  disabled: boolean;
  joinedAt: Date;
}

export interface Invitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: Date;
  createdAt: Date;
  acceptedAt: Date | null;
}

export interface Asset {
  id: string;
  organisationId: string;
  name: string;
  kind: AssetKind;
  /** WGS84 degrees. */
  latitude: number;
  longitude: number;
  material: string | null;
  /** Main span (bridges) or height (towers, masts, chimneys), metres. */
  mainDimensionM: number | null;
  /** Expected interval between records, minutes; longer without a record → `silent`. */
  expectedIntervalMin: number;
  condition: AssetCondition;
  createdAt: Date;
  updatedAt: Date;
}

/** Position of a sensor in the asset's own frame, metres. */
export interface PositionM {
  x: number;
  y: number;
  z: number;
}

export interface SensorChannel {
  id: string;
  assetId: string;
  /** Unique per asset; the column name gateways use in uploads. */
  code: string;
  positionM: PositionM;
  direction: ChannelDirection;
  quantity: ChannelQuantity;
  /** Units of the stored samples, e.g. "m/s2" for acceleration, "N" for force. */
  units: string;
  /** Sensor sensitivity (e.g. V per m/s²), informative only; null when unknown. */
  sensitivity: number | null;
  active: boolean;
}

export interface Gateway {
  id: string;
  assetId: string;
  name: string;
  /** First characters of the device key, for display (`mw_gw_ab12cd`). */
  keyPrefix: string;
  lastSeenAt: Date | null;
  revokedAt: Date | null;
  createdAt: Date;
}

/** A personal API token (the secret itself is shown once, at creation). */
export interface ApiToken {
  id: string;
  name: string;
  /** First characters of the token, for display (`mw_pat_ab12cd`). */
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

export interface AuditEntry {
  id: string;
  organisationId: string;
  actorUserId: string | null;
  /** Display name or e-mail of the actor when known (joined for the Team screen). */
  actorLabel: string | null;
  /** Dotted verb, e.g. "asset.create", "member.role_change", "gateway.revoke". */
  action: string;
  subjectType: string;
  subjectId: string | null;
  details: Record<string, unknown>;
  at: Date;
}

/** An asset with the counts the Portfolio needs (server side). */
export interface AssetListItem extends Asset {
  channelCount: number;
  openAlertCount: number;
}

/** JSON form of an asset for the client: `GET /api/v1/assets` → `{ assets: AssetSummary[] }`. */
export interface AssetSummary {
  id: string;
  name: string;
  kind: AssetKind;
  latitude: number;
  longitude: number;
  material: string | null;
  mainDimensionM: number | null;
  condition: AssetCondition;
  expectedIntervalMin: number;
  /** ISO 8601, UTC. */
  updatedAt: string;
  channelCount: number;
  /** 0 until alerts exist. */
  openAlertCount: number;
}

/** JSON form of one asset: `GET /api/v1/assets/:assetId` → `{ asset: AssetJson }`. */
export interface AssetJson extends Omit<Asset, "createdAt" | "updatedAt"> {
  createdAt: string;
  updatedAt: string;
}

/** JSON form of a gateway. */
export interface GatewayJson extends Omit<Gateway, "lastSeenAt" | "revokedAt" | "createdAt"> {
  lastSeenAt: string | null;
  revokedAt: string | null;
  createdAt: string;
}

export function toAssetSummary(a: AssetListItem): AssetSummary {
  return {
    id: a.id,
    name: a.name,
    kind: a.kind,
    latitude: a.latitude,
    longitude: a.longitude,
    material: a.material,
    mainDimensionM: a.mainDimensionM,
    condition: a.condition,
    expectedIntervalMin: a.expectedIntervalMin,
    updatedAt: a.updatedAt.toISOString(),
    channelCount: a.channelCount,
    openAlertCount: a.openAlertCount,
  };
}

export function toAssetJson(a: Asset): AssetJson {
  return { ...a, createdAt: a.createdAt.toISOString(), updatedAt: a.updatedAt.toISOString() };
}

export function toGatewayJson(g: Gateway): GatewayJson {
  return {
    ...g,
    lastSeenAt: g.lastSeenAt ? g.lastSeenAt.toISOString() : null,
    revokedAt: g.revokedAt ? g.revokedAt.toISOString() : null,
    createdAt: g.createdAt.toISOString(),
  };
}
