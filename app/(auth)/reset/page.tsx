import type { Metadata } from "next";
import { RequestResetForm } from "./_components/request-reset-form";

export const metadata: Metadata = { title: "Reset password" };

export default function RequestResetPage() {
  return (
    <div className="rounded-lg border border-line bg-surface p-5 shadow-sm">
      <h1 className="text-base font-semibold">Reset your password</h1>
      <p className="mt-1 mb-4 text-sm text-muted">We send a link to set a new password to the address of your account.</p>
      <RequestResetForm />
    </div>
  );
}
