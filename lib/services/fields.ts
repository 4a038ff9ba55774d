/**
 * Zod field builders shared by the input schemas. They accept both JSON values and the
 * strings an HTML form posts (numbers as text, checkboxes as "on", empty = not given).
 */
import { z } from "zod";

const toNumber = (v: unknown): unknown => {
  if (typeof v !== "string") return v;
  const s = v.trim();
  return s === "" ? undefined : Number(s);
};

/** A required finite number (form text or JSON number). */
export function numberField(label: string) {
  return z.preprocess(
    toNumber,
    z.number({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a number.`) })
      .refine(Number.isFinite, `${label} must be a finite number.`),
  );
}

/** An optional number where an empty form field or null means "none" (→ null). */
export function nullableNumberField(label: string) {
  return z.preprocess(
    (v) => (v === null || (typeof v === "string" && v.trim() === "") ? null : toNumber(v)),
    z.number({ error: `${label} must be a number.` }).refine(Number.isFinite, `${label} must be a finite number.`).nullable(),
  );
}

/** Optional text where an empty field means null. */
export function nullableTextField(max: number) {
  return z.preprocess(
    (v) => (typeof v === "string" && v.trim() === "" ? null : v),
    z.string().trim().max(max, `At most ${max} characters.`).nullable(),
  );
}

/** A checkbox or JSON boolean. */
export const booleanField = z.preprocess((v) => {
  if (v === "on" || v === "true" || v === "1") return true;
  if (v === "false" || v === "0" || v === "off") return false;
  return v;
}, z.boolean({ error: "Must be true or false." }));

export const emailField = z
  .string({ error: "E-mail is required." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid e-mail address." }).max(254, "At most 254 characters."));
