import { describe, expect, it } from "vitest";
import { alertRaisedEmail, ALERT_CAUTION } from "@/lib/email/templates/alert-raised";
import { alertUpdateEmail } from "@/lib/email/templates/alert-update";

const link = "http://127.0.0.1:3000/alerts/6f1c2a5e-0000-4000-8000-000000000001";

describe("alertRaisedEmail", () => {
  const mail = alertRaisedEmail({
    organisationName: "Larkspur County Structures Office", assetName: "Millrace <Footbridge> & Co", raisedAt: new Date("2026-06-03T00:00:00Z"),
    rule: "3 of the last 5 decidable residuals beyond their limits", baselineVersion: 2, link, t2: { value: 31.2, ucl: 14.8 },
    modes: [
      { label: "Vertical 1", residualHz: -0.0213, lowerLimitHz: -0.009, upperLimitHz: 0.009, residualPct: -1.01 },
      { label: "Lateral 1", residualHz: Number.NaN, lowerLimitHz: -0.01, upperLimitHz: 0.01, residualPct: null },
    ],
  });

  it("carries the evidence, the link and the caution in text and HTML", () => {
    expect(mail.text).toContain(link);
    expect(mail.html).toContain(`href="${link}"`);
    expect(mail.text).toContain("Vertical 1: daily residual −0.0213 Hz (−1.01 %)");
    expect(mail.text).toContain("Lateral 1: not identified that day");
    expect(mail.text).toContain("31.20 (limit 14.80)");
    expect(mail.text).toContain(ALERT_CAUTION);
    expect(mail.html).toContain("licensed structural engineer");
  });

  it("states the points PRODUCT.md asks of the caution", () => {
    for (const phrase of [/not an engineering assessment/, /temperature, moisture, traffic and faulty sensors/, /licensed structural engineer/, /local codes/, /emergency procedures first/]) {
      expect(ALERT_CAUTION).toMatch(phrase);
    }
  });

  it("escapes markup in names (HTML 5 §13.1.2.6)", () => {
    expect(mail.html).toContain("Millrace &lt;Footbridge&gt; &amp; Co");
    expect(mail.html).not.toContain("<Footbridge>");
  });
});

describe("alertUpdateEmail", () => {
  it("names the outcome and findings on closure, with the link and the caution", () => {
    const m = alertUpdateEmail({ kind: "closed", assetName: "Fernbrook", raisedAt: new Date("2026-06-03T00:00:00Z"), actorName: "Ines", outcome: "no_defect_found", findings: "Nothing found.", link,
      evidence: ["Mode 1: daily residual −0.0400 Hz, limits −0.0200 Hz to +0.0200 Hz."] });
    expect(m.subject).toBe("Alert closed: Fernbrook");
    // The evidence summary travels in both parts (issue 5: evidence, link and caution in text and HTML).
    expect(m.text).toContain("Mode 1: daily residual −0.0400 Hz");
    expect(m.html).toContain("Mode 1: daily residual −0.0400 Hz");
    expect(m.text).toContain("no defect found");
    expect(m.text).toContain("Nothing found.");
    expect(m.text).toContain(link);
    expect(m.html).toContain("not an engineering assessment");
  });
});
