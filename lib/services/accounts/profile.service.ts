/** The signed-in user's own profile and current organisation. */
import { db } from "@/lib/db/knex";
import { findOrganisationById } from "@/lib/db/repos/organisation.repo";
import { findUserById } from "@/lib/db/repos/user.repo";
import type { Actor, Organisation } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";

export interface Profile {
  userId: string;
  email: string;
  displayName: string;
}

export async function getProfile(actor: Actor): Promise<Profile> {
  const user = await findUserById(db(), actor.userId);
  if (!user) throw new AppError("unauthorized", "Sign in again.");
  return { userId: user.id, email: user.email, displayName: user.displayName };
}

/** The actor's current organisation (name, time zone for displaying times). */
export async function getOrganisation(actor: Actor): Promise<Organisation> {
  const org = await findOrganisationById(db(), actor.organisationId);
  if (!org) throw new AppError("not_found", "No such organisation.");
  return org;
}
