/**
 * Session helpers for server components and server actions (Next-bound: uses next/headers).
 * `getActor()` never redirects; pages decide what to do with null.
 */
import { cookies } from "next/headers";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { actorFromSessionCookies } from "./session-token";

/** The signed-in actor (current organisation and its current role), or null. */
export async function getActor(): Promise<Actor | null> {
  const store = await cookies();
  return actorFromSessionCookies(store.getAll());
}

/** The signed-in actor, or AppError('unauthorized'). */
export async function requireActor(): Promise<Actor> {
  const actor = await getActor();
  if (!actor) throw new AppError("unauthorized", "Sign in to continue.");
  return actor;
}
