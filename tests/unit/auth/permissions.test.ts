import { describe, expect, it } from "vitest";
import { ACTIONS, ROLES, can, isRole, type Action, type Role } from "@/lib/auth/permissions";

/**
 * The role table of PRODUCT.md §"Users and roles", written out by hand, cell by cell.
 * Sources per action:
 *  - portfolio:read — "view map, assets, trends, alerts and reports" (owner), "view everything"
 *    (inspector); engineer and admin include it.
 *  - asset:write, channel:write — engineer: "assets, sensor layouts"; admin: "everything below".
 *  - gateway:write — admin only: "plus users, invitations, gateways and their keys".
 *  - mode:write, baseline:write, settings:write, record:reprocess — engineer: "tracked modes,
 *    baselines, alarm settings, reprocessing".
 *  - alert:close — engineer "closing any alert"; inspector "close alerts".
 *  - alert:work — inspector "acknowledge, schedule, record findings"; engineer: [interpretation]
 *    an engineer who may close any alert may also acknowledge and comment on it (lead's table).
 *  - team:write — admin only: "users, invitations".
 *  - team:read, token:own — [interpretation of issue 2 items 6–7] every member sees who is in
 *    the team and may hold personal API tokens acting with their own role.
 *  - audit:read — [interpretation] admins and engineers read the audit trail; inspectors and
 *    owners do not ("change nothing", field work only).
 */
const Y = true;
const N = false;
const EXPECTED: Record<Action, Record<Role, boolean>> = {
  "portfolio:read": { admin: Y, engineer: Y, inspector: Y, owner: Y },
  "asset:write": { admin: Y, engineer: Y, inspector: N, owner: N },
  "channel:write": { admin: Y, engineer: Y, inspector: N, owner: N },
  "gateway:write": { admin: Y, engineer: N, inspector: N, owner: N },
  "mode:write": { admin: Y, engineer: Y, inspector: N, owner: N },
  "baseline:write": { admin: Y, engineer: Y, inspector: N, owner: N },
  "settings:write": { admin: Y, engineer: Y, inspector: N, owner: N },
  "record:reprocess": { admin: Y, engineer: Y, inspector: N, owner: N },
  "alert:work": { admin: Y, engineer: Y, inspector: Y, owner: N },
  "alert:close": { admin: Y, engineer: Y, inspector: Y, owner: N },
  "team:read": { admin: Y, engineer: Y, inspector: Y, owner: Y },
  "team:write": { admin: Y, engineer: N, inspector: N, owner: N },
  "audit:read": { admin: Y, engineer: Y, inspector: N, owner: N },
  "token:own": { admin: Y, engineer: Y, inspector: Y, owner: Y },
};

describe("can(role, action)", () => {
  it("knows exactly the roles of PRODUCT.md", () => {
    expect([...ROLES].sort()).toEqual(["admin", "engineer", "inspector", "owner"]);
  });

  it("has an expected cell for every action (a new action must be added to this table)", () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ACTIONS].sort());
  });

  for (const action of Object.keys(EXPECTED) as Action[]) {
    for (const role of ROLES) {
      const allowed = EXPECTED[action][role];
      it(`${allowed ? "allows" : "refuses"} ${action} to ${role}`, () => {
        expect(can(role, action)).toBe(allowed);
      });
    }
  }

  it("gives the owner nothing that changes data (PRODUCT.md: 'change nothing')", () => {
    const changes = ACTIONS.filter((a) => a.endsWith(":write") || a === "record:reprocess" || a.startsWith("alert:"));
    expect(changes.filter((a) => can("owner", a))).toEqual([]);
  });

  it("gives the admin every action (PRODUCT.md: 'everything below, plus …')", () => {
    expect(ACTIONS.every((a) => can("admin", a))).toBe(true);
  });

  it("recognises roles and rejects other strings", () => {
    expect(ROLES.every(isRole)).toBe(true);
    expect(isRole("gateway")).toBe(false);
    expect(isRole("Admin")).toBe(false);
    expect(isRole(undefined)).toBe(false);
  });
});
