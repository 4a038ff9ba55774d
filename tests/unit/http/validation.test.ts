import { describe, expect, it } from "vitest";
import { z } from "zod";
import { fieldErrorsOf, formDataToObject } from "@/lib/http/validation";

describe("fieldErrorsOf", () => {
  it("lists every problem under its dotted field path, not only the first", () => {
    const schema = z.object({ name: z.string().min(1, "Name is required."), positionM: z.object({ x: z.number("x!") }) });
    const r = schema.safeParse({ name: "", positionM: { x: "a" } });
    expect(r.success).toBe(false);
    if (r.success) return;
    expect(fieldErrorsOf(r.error)).toEqual({ name: ["Name is required."], "positionM.x": ["x!"] });
  });

  it("puts object-level problems under _form", () => {
    const r = z.string().safeParse(3);
    expect(r.success).toBe(false);
    if (!r.success) expect(Object.keys(fieldErrorsOf(r.error))).toEqual(["_form"]);
  });
});

describe("formDataToObject", () => {
  it("keeps single values, collects repeated keys and drops Next's $ACTION_ fields", () => {
    const fd = new FormData();
    fd.append("email", "a@b.example");
    fd.append("tag", "x");
    fd.append("tag", "y");
    fd.append("$ACTION_ID_123", "");
    expect(formDataToObject(fd)).toEqual({ email: "a@b.example", tag: ["x", "y"] });
  });
});
