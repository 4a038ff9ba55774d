/**
 * The one place where snake_case rows become camelCase domain objects (and back).
 * Row interfaces mirror db/migrations; repos select exactly these columns.
 */
import type {
  ApiToken, Asset, AssetCondition, AssetKind, AuditEntry, ChannelDirection, ChannelQuantity,
  Gateway, Invitation, Member, Membership, Organisation, SensorChannel,
} from "@/lib/domain/types";
import type { Role } from "@/lib/auth/permissions";

export interface OrganisationRow { id: string; name: string; time_zone: string }
export interface UserRow {
  id: string; email: string; password_hash: string; display_name: string; disabled: boolean;
  created_at: Date; updated_at: Date;
}
export interface MembershipRow { organisation_id: string; organisation_name: string; role: Role }
export interface MemberRow {
  user_id: string; email: string; display_name: string; role: Role; disabled: boolean; created_at: Date;
}
export interface InvitationRow {
  id: string; organisation_id: string; email: string; role: Role; token_hash: string;
  invited_by_user_id: string | null; expires_at: Date; accepted_at: Date | null; revoked_at: Date | null;
  created_at: Date;
}
export interface PasswordResetRow {
  id: string; user_id: string; token_hash: string; expires_at: Date; used_at: Date | null; created_at: Date;
}
export interface AssetRow {
  id: string; organisation_id: string; name: string; kind: AssetKind; latitude: number; longitude: number;
  material: string | null; main_dimension_m: number | null; expected_interval_min: number;
  condition: AssetCondition; created_at: Date; updated_at: Date;
}
export interface SensorChannelRow {
  id: string; asset_id: string; code: string; position_x_m: number; position_y_m: number; position_z_m: number;
  direction: ChannelDirection; quantity: ChannelQuantity; units: string; sensitivity: number | null; active: boolean;
}
export interface GatewayRow {
  id: string; asset_id: string; name: string; key_prefix: string; last_seen_at: Date | null;
  revoked_at: Date | null; created_at: Date;
}
export interface ApiTokenRow {
  id: string; user_id: string; organisation_id: string; name: string; prefix: string; created_at: Date;
  last_used_at: Date | null; revoked_at: Date | null;
}
export interface AuditRow {
  id: string; organisation_id: string; actor_user_id: string | null; actor_label: string | null; action: string;
  subject_type: string; subject_id: string | null; details: Record<string, unknown> | null; at: Date;
}

/** pg returns double precision as number but numeric/bigint as string; be explicit. */
const num = (v: number | string): number => (typeof v === "number" ? v : Number(v));
const numOrNull = (v: number | string | null): number | null => (v === null ? null : num(v));

export const toOrganisation = (r: OrganisationRow): Organisation => ({ id: r.id, name: r.name, timeZone: r.time_zone });

export const toMembership = (r: MembershipRow): Membership => ({
  organisationId: r.organisation_id, organisationName: r.organisation_name, role: r.role,
});

export const toMember = (r: MemberRow): Member => ({
  userId: r.user_id, email: r.email, displayName: r.display_name, role: r.role, disabled: r.disabled,
  joinedAt: r.created_at,
});

export const toInvitation = (r: InvitationRow): Invitation => ({
  id: r.id, email: r.email, role: r.role, expiresAt: r.expires_at, createdAt: r.created_at, acceptedAt: r.accepted_at,
});

export const toAsset = (r: AssetRow): Asset => ({
  id: r.id,
  organisationId: r.organisation_id,
  name: r.name,
  kind: r.kind,
  latitude: num(r.latitude),
  longitude: num(r.longitude),
  material: r.material,
  mainDimensionM: numOrNull(r.main_dimension_m),
  expectedIntervalMin: num(r.expected_interval_min),
  condition: r.condition,
  createdAt: r.created_at,
  updatedAt: r.updated_at,
});

/** Domain fields of an asset that callers may write → columns. Undefined fields are left out. */
export function fromAssetPatch(p: Partial<Omit<Asset, "id" | "organisationId" | "createdAt" | "updatedAt">>) {
  const row: Partial<Omit<AssetRow, "id" | "organisation_id" | "created_at" | "updated_at">> = {};
  if (p.name !== undefined) row.name = p.name;
  if (p.kind !== undefined) row.kind = p.kind;
  if (p.latitude !== undefined) row.latitude = p.latitude;
  if (p.longitude !== undefined) row.longitude = p.longitude;
  if (p.material !== undefined) row.material = p.material;
  if (p.mainDimensionM !== undefined) row.main_dimension_m = p.mainDimensionM;
  if (p.expectedIntervalMin !== undefined) row.expected_interval_min = p.expectedIntervalMin;
  if (p.condition !== undefined) row.condition = p.condition;
  return row;
}

export const toSensorChannel = (r: SensorChannelRow): SensorChannel => ({
  id: r.id,
  assetId: r.asset_id,
  code: r.code,
  positionM: { x: num(r.position_x_m), y: num(r.position_y_m), z: num(r.position_z_m) },
  direction: r.direction,
  quantity: r.quantity,
  units: r.units,
  sensitivity: numOrNull(r.sensitivity),
  active: r.active,
});

export function fromChannelPatch(p: Partial<Omit<SensorChannel, "id" | "assetId">>) {
  const row: Partial<Omit<SensorChannelRow, "id" | "asset_id">> = {};
  if (p.code !== undefined) row.code = p.code;
  if (p.positionM !== undefined) {
    row.position_x_m = p.positionM.x;
    row.position_y_m = p.positionM.y;
    row.position_z_m = p.positionM.z;
  }
  if (p.direction !== undefined) row.direction = p.direction;
  if (p.quantity !== undefined) row.quantity = p.quantity;
  if (p.units !== undefined) row.units = p.units;
  if (p.sensitivity !== undefined) row.sensitivity = p.sensitivity;
  if (p.active !== undefined) row.active = p.active;
  return row;
}

export const toGateway = (r: GatewayRow): Gateway => ({
  id: r.id, assetId: r.asset_id, name: r.name, keyPrefix: r.key_prefix, lastSeenAt: r.last_seen_at,
  revokedAt: r.revoked_at, createdAt: r.created_at,
});

export const toApiToken = (r: ApiTokenRow): ApiToken => ({
  id: r.id, name: r.name, prefix: r.prefix, createdAt: r.created_at, lastUsedAt: r.last_used_at, revokedAt: r.revoked_at,
});

export const toAuditEntry = (r: AuditRow): AuditEntry => ({
  id: r.id,
  organisationId: r.organisation_id,
  actorUserId: r.actor_user_id,
  actorLabel: r.actor_label,
  action: r.action,
  subjectType: r.subject_type,
  subjectId: r.subject_id,
  details: r.details ?? {},
  at: r.at,
});
