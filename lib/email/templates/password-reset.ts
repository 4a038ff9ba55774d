import { layoutHtml, type RenderedEmail } from "./escape";

export interface PasswordResetEmailData {
  displayName: string;
  link: string;
  validMinutes: number;
}

/** The password-reset e-mail with its single-use link. */
export function passwordResetEmail(d: PasswordResetEmailData): RenderedEmail {
  const lines = [
    `Hello ${d.displayName},`,
    `Someone asked to reset the password of your Modewarden account. Open the link within ${d.validMinutes} minutes to choose a new password; it works once.`,
  ];
  const footer = "If you did not ask for this, ignore this message: your password stays as it is.";
  return {
    subject: "Reset your Modewarden password",
    text: `${lines.join("\n\n")}\n\n${d.link}\n\n${footer}\n`,
    html: layoutHtml(lines, { href: d.link, label: "Choose a new password" }, footer),
  };
}
