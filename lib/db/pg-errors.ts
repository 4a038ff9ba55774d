/**
 * Translation of PostgreSQL driver errors into AppError. Nothing above lib/db sees a
 * driver code: repos wrap their writes with `translateDbError`.
 */
import { AppError } from "@/lib/http/errors";

/** Unique and check constraints that map to one form field, with the message shown under it. */
const CONSTRAINT_FIELDS: Record<string, { field: string; message: string }> = {
  users_email_unique: { field: "email", message: "An account with this e-mail already exists." },
  invitations_pending_unique: { field: "email", message: "An invitation to this e-mail is already pending." },
  assets_organisation_name_unique: { field: "name", message: "Another asset of this organisation has this name." },
  sensor_channels_asset_code_unique: { field: "code", message: "Another channel of this asset has this code." },
  sensor_channels_code_format: { field: "code", message: "Use letters, digits, '_', '.' or '-' (at most 32)." },
  assets_latitude_range: { field: "latitude", message: "Latitude must be between -90 and 90." },
  assets_longitude_range: { field: "longitude", message: "Longitude must be between -180 and 180." },
};

interface PgLikeError { code: string; constraint?: string }

function isPgError(e: unknown): e is PgLikeError {
  return typeof e === "object" && e !== null && typeof (e as { code?: unknown }).code === "string"
    && /^[0-9A-Z]{5}$/.test((e as { code: string }).code);
}

/** Map a driver error to AppError; anything unrecognised is returned unchanged (an unknown error). */
export function translateDbError(e: unknown): unknown {
  if (!isPgError(e)) return e;
  const known = e.constraint ? CONSTRAINT_FIELDS[e.constraint] : undefined;
  const fieldErrors = known ? { [known.field]: [known.message] } : undefined;
  const details = e.constraint ? { constraint: e.constraint } : undefined;
  switch (e.code) {
    case "23505":
      return new AppError("conflict", known?.message ?? "This already exists.", { details, fieldErrors });
    case "23503":
      return new AppError("not_found", "A referenced item does not exist.", { details });
    case "23514":
    case "23502":
    case "22003":
      return new AppError("unprocessable", known?.message ?? "The values break a rule of the data model.", {
        details, fieldErrors,
      });
    case "22P02":
      return new AppError("not_found", "No such item.");
    default:
      return e;
  }
}

/** Run a query and translate its driver errors. */
export async function withDbErrors<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    throw translateDbError(e);
  }
}
