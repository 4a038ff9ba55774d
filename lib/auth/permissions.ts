/**
 * The role table of PRODUCT.md, as pure data. Services call `assertCan(actor, action)`
 * and then check the row's organisation; nothing else decides who may do what.
 */
export const ROLES = ["admin", "engineer", "inspector", "owner"] as const;
export type Role = (typeof ROLES)[number];

export const ACTIONS = [
  "portfolio:read", // map, assets, trends, records, alerts, reports
  "asset:write", // create and edit assets
  "channel:write", // sensor layout
  "gateway:write", // create gateways, show key once, revoke
  "mode:write", // tracked modes
  "baseline:write",
  "settings:write", // analysis settings and alarm settings
  "record:reprocess",
  "alert:work", // acknowledge, schedule, comment, attach findings
  "alert:close",
  "team:read",
  "team:write", // invitations, roles, removal
  "audit:read",
  "token:own", // personal API tokens of one's own account
] as const;
export type Action = (typeof ACTIONS)[number];

const TABLE: Record<Role, readonly Action[]> = {
  admin: ACTIONS,
  engineer: [
    "portfolio:read", "asset:write", "channel:write", "mode:write", "baseline:write", "settings:write",
    "record:reprocess", "alert:work", "alert:close", "team:read", "audit:read", "token:own",
  ],
  inspector: ["portfolio:read", "alert:work", "alert:close", "team:read", "token:own"],
  owner: ["portfolio:read", "team:read", "token:own"],
};

const SETS: Record<Role, ReadonlySet<Action>> = {
  admin: new Set(TABLE.admin),
  engineer: new Set(TABLE.engineer),
  inspector: new Set(TABLE.inspector),
  owner: new Set(TABLE.owner),
};

/** Whether `role` may perform `action`. */
export function can(role: Role, action: Action): boolean {
  return SETS[role].has(action);
}

export function isRole(v: unknown): v is Role {
  return typeof v === "string" && (ROLES as readonly string[]).includes(v);
}
