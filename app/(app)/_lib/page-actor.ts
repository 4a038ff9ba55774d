import { redirect } from "next/navigation";
import { getActor } from "@/lib/auth/session";
import type { Actor } from "@/lib/domain/types";

/** The actor for a signed-in page; without a session the page sends the browser to sign-in. */
export async function pageActor(): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect("/sign-in");
  return actor;
}
