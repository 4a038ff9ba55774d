import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { findInvitationByToken } from "@/lib/services/team/team.service";
import { ROLE_LABELS } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { AcceptInvitationForm } from "./_components/accept-invitation-form";

export const metadata: Metadata = { title: "Accept invitation" };

/** Invitation link from the e-mail: shows who is invited where, and sets the password. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  await connection();
  const { token } = await params;
  const invitation = await findInvitationByToken(token);
  if (!invitation) {
    return (
      <div className="space-y-3 rounded-lg border border-line bg-surface p-5">
        <h1 className="text-base font-semibold">Invitation not valid</h1>
        <Notice tone="error">This invitation link has expired, was already used, or is incomplete. Ask your administrator for a new one.</Notice>
        <Link href="/sign-in" className="text-sm text-accent hover:underline">
          Go to sign-in
        </Link>
      </div>
    );
  }
  return (
    <div className="rounded-lg border border-line bg-surface p-5 shadow-sm">
      <h1 className="text-base font-semibold">Join {invitation.organisationName}</h1>
      <p className="mt-1 mb-4 text-sm text-muted">
        You are invited as <strong className="text-ink">{ROLE_LABELS[invitation.role]}</strong> with{" "}
        <span className="font-mono text-xs text-ink">{invitation.email}</span>.{" "}
        {invitation.existingAccount ? "This e-mail already has an account: confirm with its password." : "Choose your name and a password."}
      </p>
      <AcceptInvitationForm token={token} existingAccount={invitation.existingAccount} email={invitation.email} />
    </div>
  );
}
