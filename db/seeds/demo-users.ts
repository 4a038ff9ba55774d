/**
 * The demo organisation of PRODUCT.md (Larkspur County Structures Office, invented) and its
 * sign-ins, one per role. The launcher prints them and the sign-in page shows them in demo
 * mode only. This file is also the Knex seed (knex runs every file of db/seeds): the data
 * live in ./larkspur/ and are loaded only when seeding.
 */
import type { Knex } from "knex";
import type { Role } from "../../lib/auth/permissions";

export interface DemoSignIn {
  role: Role;
  email: string;
  password: string;
  displayName: string;
}

/** Demo sign-ins (passwords ≥ 12 characters). Never valid outside a demo database. */
export const DEMO_SIGN_INS: readonly DemoSignIn[] = [
  { role: "admin", email: "admin@larkspur.example", password: "larkspur-admin-2026", displayName: "Morgan Hale" },
  { role: "engineer", email: "engineer@larkspur.example", password: "larkspur-engineer-2026", displayName: "Priya Castellan" },
  { role: "inspector", email: "inspector@larkspur.example", password: "larkspur-inspector-2026", displayName: "Tomas Reyes" },
  { role: "owner", email: "owner@larkspur.example", password: "larkspur-owner-2026", displayName: "Dana Whitcombe" },
];

export const DEMO_ORGANISATION = {
  id: "6c1a0000-0000-4000-8000-000000000001",
  name: "Larkspur County Structures Office",
  timeZone: "America/Denver",
} as const;

/** Knex seed entry point: idempotent; refuses in production unless MODEWARDEN_DEMO=1. */
export async function seed(knex: Knex): Promise<void> {
  const { seedLarkspurDemo } = await import("./larkspur/seed-demo");
  await seedLarkspurDemo(knex);
}
