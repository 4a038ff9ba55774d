import type { Metadata } from "next";
import { ResetPasswordForm } from "./_components/reset-password-form";

export const metadata: Metadata = { title: "Choose a new password" };

/** Reset link from the e-mail; the token is checked when the form is sent. */
export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <div className="rounded-lg border border-line bg-surface p-5 shadow-sm">
      <h1 className="text-base font-semibold">Choose a new password</h1>
      <p className="mt-1 mb-4 text-sm text-muted">At least 12 characters. Other devices stay signed in until their session ends.</p>
      <ResetPasswordForm token={token} />
    </div>
  );
}
