/**
 * The one server-action wrapper (CONVENTIONS §6): parse the FormData with the service's
 * schema, find the actor, run, and answer `{ ok: true, data }` or
 * `{ ok: false, message, fieldErrors }` for `useActionState`. Raw errors never reach the UI.
 */
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import type { Actor } from "@/lib/domain/types";
import { getActor } from "@/lib/auth/session";
import { isAppError } from "./errors";
import { logUnknownError, somethingWentWrong } from "./log";
import { fieldErrorsOf, formDataToObject } from "./validation";

export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; message: string; fieldErrors: Record<string, string[]> };

type Action<T> = (prevState: unknown, formData: FormData) => Promise<ActionResult<T>>;

function failure(e: unknown, name: string): ActionResult<never> {
  unstable_rethrow(e); // redirect(), notFound() and Next's own signals pass through
  if (isAppError(e)) return { ok: false, message: e.message, fieldErrors: e.fieldErrors ?? {} };
  const ref = logUnknownError(e, { action: name });
  return { ok: false, message: somethingWentWrong(ref), fieldErrors: {} };
}

async function run<S extends z.ZodType, T>(
  schema: S, formData: FormData, name: string, body: (input: z.infer<S>) => Promise<T>,
): Promise<ActionResult<T>> {
  const parsed = schema.safeParse(formDataToObject(formData));
  if (!parsed.success) {
    return { ok: false, message: "Please correct the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error) };
  }
  try {
    return { ok: true, data: await body(parsed.data) };
  } catch (e) {
    return failure(e, name);
  }
}

/** An action for a signed-in user; the handler gets the parsed input and the actor. */
export function defineAction<S extends z.ZodType, T>(
  schema: S,
  handler: (input: z.infer<S>, actor: Actor) => Promise<T>,
): Action<T> {
  return async (_prev, formData) => {
    let actor: Actor | null;
    try {
      actor = await getActor();
    } catch (e) {
      return failure(e, handler.name);
    }
    if (!actor) return { ok: false, message: "Your session has ended. Sign in again.", fieldErrors: {} };
    const a = actor;
    return run(schema, formData, handler.name, (input) => handler(input, a));
  };
}

/** An action open to signed-out visitors (accepting an invitation, password reset). */
export function definePublicAction<S extends z.ZodType, T>(
  schema: S,
  handler: (input: z.infer<S>) => Promise<T>,
): Action<T> {
  return async (_prev, formData) => run(schema, formData, handler.name, handler);
}
