import { describe, expect, it } from "vitest";
import { cautionText, type CautionSubject } from "@/lib/domain/caution";

// The points the caution must make come from the product brief (PRODUCT.md §Caution):
// automated indication, not an engineering assessment; environmental and sensor causes;
// review by a licensed structural engineer and inspection under local codes and the owner's
// procedures before decisions on use, load limits or closure; emergency procedures first.
const POINTS = [
  /automatic indication computed from vibration measurements/,
  /not an engineering assessment/,
  /temperature, moisture, traffic and faulty sensors/,
  /licensed structural engineer must review/,
  /local codes and the owner's procedures/,
  /use, load limits or closure/,
  /signs of distress, follow the owner's emergency procedures first/,
];

describe("the caution", () => {
  it.each(["alert", "report", "condition", "comparisons"] as CautionSubject[])("makes every point of the brief for %s", (s) => {
    const text = cautionText(s);
    for (const p of POINTS) expect(text).toMatch(p);
  });

  it("names what it is shown on, with agreeing grammar", () => {
    expect(cautionText("alert").startsWith("This alert is an automatic")).toBe(true);
    expect(cautionText("comparisons")).toMatch(/^These comparisons are an automatic .*; they are not .* must review them,/);
  });
});
