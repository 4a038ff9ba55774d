import { describe, expect, it } from "vitest";
import { translateDbError } from "@/lib/db/pg-errors";
import { AppError } from "@/lib/http/errors";

// SQLSTATE codes from the PostgreSQL 15 manual, Appendix A "PostgreSQL Error Codes".
describe("translateDbError", () => {
  it("turns unique_violation (23505) into conflict with the field of a known constraint", () => {
    const e = translateDbError({ code: "23505", constraint: "sensor_channels_asset_code_unique" });
    expect(e).toBeInstanceOf(AppError);
    expect((e as AppError).code).toBe("conflict");
    expect(Object.keys((e as AppError).fieldErrors ?? {})).toEqual(["code"]);
  });

  it("turns foreign_key_violation (23503) into not_found and check_violation (23514) into unprocessable", () => {
    expect((translateDbError({ code: "23503", constraint: "x" }) as AppError).code).toBe("not_found");
    expect((translateDbError({ code: "23514", constraint: "assets_latitude_range" }) as AppError).code).toBe("unprocessable");
  });

  it("leaves errors that are not from the driver unchanged", () => {
    const err = new Error("boom");
    expect(translateDbError(err)).toBe(err);
    expect(translateDbError({ code: "ECONNREFUSED" })).toEqual({ code: "ECONNREFUSED" });
  });
});
