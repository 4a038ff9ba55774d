import { notFound } from "next/navigation";
import { isAppError } from "@/lib/http/errors";

/** Await a service call; a `not_found` AppError (also another organisation's id) renders the 404 page. */
export async function orNotFound<T>(p: Promise<T>): Promise<T> {
  try {
    return await p;
  } catch (e) {
    if (isAppError(e) && e.code === "not_found") notFound();
    throw e;
  }
}
