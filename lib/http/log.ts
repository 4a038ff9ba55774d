/**
 * Structured logging for the edges: one JSON line per event on stdout/stderr. Unknown
 * errors get a short reference id that the user sees ("Something went wrong (ref …)") and
 * the operator finds in the log next to the stack.
 */
import { randomBytes } from "node:crypto";
import { env } from "@/lib/config/env";

const LEVELS = { debug: 10, info: 20, warn: 30, error: 40 } as const;
type Level = keyof typeof LEVELS;

export function log(level: Level, event: string, fields: Record<string, unknown> = {}): void {
  if (LEVELS[level] < LEVELS[env().LOG_LEVEL]) return;
  const line = JSON.stringify({ t: new Date().toISOString(), level, event, ...fields });
  if (level === "error" || level === "warn") console.error(line);
  else console.log(line);
}

/** A short reference id for an unknown error (8 hex characters). */
export function newErrorRef(): string {
  return randomBytes(4).toString("hex");
}

/** Log an unknown error with its stack; returns the reference shown to the user. */
export function logUnknownError(err: unknown, context: Record<string, unknown> = {}): string {
  const ref = newErrorRef();
  const e = err instanceof Error ? { name: err.name, message: err.message, stack: err.stack } : { value: String(err) };
  log("error", "unhandled_error", { ref, ...context, error: e });
  return ref;
}

export function somethingWentWrong(ref: string): string {
  return `Something went wrong (ref ${ref}).`;
}
