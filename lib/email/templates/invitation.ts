import type { Role } from "@/lib/auth/permissions";
import { layoutHtml, type RenderedEmail } from "./escape";

export interface InvitationEmailData {
  organisationName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
}

/** The invitation e-mail: who invites, to which organisation, as which role, and the link. */
export function invitationEmail(d: InvitationEmailData): RenderedEmail {
  const expires = d.expiresAt.toISOString().replace("T", " ").slice(0, 16) + " UTC";
  const lines = [
    `${d.inviterName} invites you to join ${d.organisationName} on Modewarden as ${d.role}.`,
    `Open the link to choose your name and password. The link works once and expires on ${expires}.`,
  ];
  const footer = "If you did not expect this invitation, ignore this message.";
  return {
    subject: `Invitation to ${d.organisationName} on Modewarden`,
    text: `${lines.join("\n\n")}\n\n${d.link}\n\n${footer}\n`,
    html: layoutHtml(lines, { href: d.link, label: "Accept the invitation" }, footer),
  };
}
