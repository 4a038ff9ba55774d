/**
 * The one route-handler wrapper (CONVENTIONS §6): authenticate, parse params / query /
 * JSON body with zod, call the handler, map errors to `{ error: { code, message, details } }`.
 *  - auth 'user': `Authorization: Bearer mw_pat_…` (personal API token) or the session cookie;
 *  - auth 'device': `Authorization: Bearer mw_gw_…` (gateway key), nothing else;
 *  - auth 'none': open.
 * Params that do not parse answer 404 (an id that cannot exist); query and body issues 422
 * with `details.fieldErrors`; a body that is not JSON 400 / 415.
 */
import type { z } from "zod";
import { bearerFrom } from "@/lib/auth/tokens";
import { actorFromSessionCookies, parseCookieHeader } from "@/lib/auth/session-token";
import type { Actor } from "@/lib/domain/types";
import { actorFromApiToken } from "@/lib/services/accounts/api-token.service";
import { deviceFromGatewayKey, type DeviceActor } from "@/lib/services/assets/gateway.service";
import { AppError, isAppError } from "./errors";
import { log, logUnknownError, somethingWentWrong } from "./log";
import { fieldErrorsOf } from "./validation";

type AuthMode = "user" | "device" | "none";
type Out<S> = S extends z.ZodType ? z.infer<S> : undefined;
type Who<A extends AuthMode> = A extends "user" ? { actor: Actor } : A extends "device" ? { device: DeviceActor } : object;

export interface RouteSpec<P, Q, B, A extends AuthMode> {
  auth: A;
  params?: P;
  query?: Q;
  body?: B;
}

export type RouteContext<P, Q, B, A extends AuthMode> = {
  req: Request;
  params: Out<P>;
  query: Out<Q>;
  body: Out<B>;
} & Who<A>;

/** What Next passes as the second argument of a route handler. */
export interface NextRouteContext {
  params: Promise<Record<string, string | string[] | undefined>>;
}

/** A JSON response (Dates become ISO strings through JSON.stringify). */
export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store", ...headers },
  });
}

export function errorResponse(code: string, message: string, status: number, details?: Record<string, unknown>): Response {
  return json({ error: { code, message, details: details ?? {} } }, status);
}

function appErrorResponse(e: AppError): Response {
  const details = { ...(e.details ?? {}), ...(e.fieldErrors ? { fieldErrors: e.fieldErrors } : {}) };
  return errorResponse(e.code, e.message, e.status, details);
}

async function authenticateUser(req: Request): Promise<Actor> {
  const bearer = bearerFrom(req.headers.get("authorization"));
  const actor = bearer
    ? await actorFromApiToken(bearer)
    : await actorFromSessionCookies(parseCookieHeader(req.headers.get("cookie")));
  if (!actor) {
    throw new AppError("unauthorized", bearer ? "The API token is unknown or revoked." : "Sign in or send a personal API token.");
  }
  return actor;
}

async function authenticateDevice(req: Request): Promise<DeviceActor> {
  const bearer = bearerFrom(req.headers.get("authorization"));
  const device = bearer ? await deviceFromGatewayKey(bearer) : null;
  if (!device) throw new AppError("unauthorized", "The gateway key is missing, unknown or revoked.");
  return device;
}

async function readJsonBody(req: Request): Promise<unknown> {
  const type = req.headers.get("content-type") ?? "";
  const text = await req.text();
  if (text.trim() === "") return {};
  if (!/^application\/(?:[\w.+-]+\+)?json\b/i.test(type)) {
    throw new AppError("unsupported_media_type", "Send the body as application/json.");
  }
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The body is not valid JSON.");
  }
}

function parseOr<S extends z.ZodType>(schema: S, value: unknown, onFail: (e: z.ZodError) => AppError): z.infer<S> {
  const r = schema.safeParse(value);
  if (!r.success) throw onFail(r.error);
  return r.data;
}

const invalid = (what: string) => (e: z.ZodError) =>
  new AppError("unprocessable", `The ${what} has invalid fields.`, { fieldErrors: fieldErrorsOf(e) });

export function defineRoute<
  A extends AuthMode,
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
>(
  spec: RouteSpec<P, Q, B, A>,
  handler: (ctx: RouteContext<P, Q, B, A>) => Promise<Response>,
): (req: Request, ctx?: NextRouteContext) => Promise<Response> {
  return async (req, nextCtx) => {
    const started = Date.now();
    const path = new URL(req.url).pathname;
    let res: Response;
    try {
      const who: Record<string, unknown> = {};
      if (spec.auth === "user") who.actor = await authenticateUser(req);
      else if (spec.auth === "device") who.device = await authenticateDevice(req);
      const rawParams = nextCtx ? await nextCtx.params : {};
      const params = spec.params
        ? parseOr(spec.params, rawParams, () => new AppError("not_found", "No such item."))
        : undefined;
      const query = spec.query
        ? parseOr(spec.query, Object.fromEntries(new URL(req.url).searchParams), invalid("query"))
        : undefined;
      const body = spec.body ? parseOr(spec.body, await readJsonBody(req), invalid("request body")) : undefined;
      res = await handler({ req, params, query, body, ...who } as RouteContext<P, Q, B, A>);
    } catch (e) {
      if (isAppError(e)) {
        res = appErrorResponse(e);
      } else {
        const ref = logUnknownError(e, { method: req.method, path });
        res = errorResponse("internal_error", somethingWentWrong(ref), 500, { ref });
      }
    }
    log(res.status >= 500 ? "warn" : "debug", "request", { method: req.method, path, status: res.status, ms: Date.now() - started });
    return res;
  };
}
