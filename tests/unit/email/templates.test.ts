import { describe, expect, it } from "vitest";
import { invitationEmail } from "@/lib/email/templates/invitation";
import { passwordResetEmail } from "@/lib/email/templates/password-reset";

describe("invitationEmail", () => {
  const link = "http://127.0.0.1:3000/invite/abc_DEF-123";
  const mail = invitationEmail({
    organisationName: "Larkspur <County> & Co", inviterName: "Morgan Hale", role: "inspector", link,
    expiresAt: new Date("2026-03-01T12:00:00Z"),
  });

  it("carries the link in the text and the HTML parts", () => {
    expect(mail.text).toContain(link);
    expect(mail.html).toContain(`href="${link}"`);
  });

  it("escapes markup in names (HTML 5 §13.1.2.6: & and < must be escaped in text)", () => {
    expect(mail.html).toContain("Larkspur &lt;County&gt; &amp; Co");
    expect(mail.html).not.toContain("<County>");
    expect(mail.subject).toContain("Larkspur <County> & Co");
  });
});

describe("passwordResetEmail", () => {
  it("names the validity and carries the link", () => {
    const m = passwordResetEmail({ displayName: "Tomas", link: "http://x/reset/t0k", validMinutes: 60 });
    expect(m.text).toContain("http://x/reset/t0k");
    expect(m.text).toContain("60 minutes");
  });
});
