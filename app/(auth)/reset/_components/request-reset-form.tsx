"use client";

import Link from "next/link";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { requestPasswordResetAction } from "../../actions";

export function RequestResetForm() {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(requestPasswordResetAction);
  if (state?.ok) {
    return (
      <div className="space-y-3">
        <Notice tone="success">If an account uses that address, a reset link is on its way. It is valid for a short time.</Notice>
        <Link href="/sign-in" className="text-sm text-accent hover:underline">
          Back to sign-in
        </Link>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <TextField label="E-mail" name="email" type="email" autoComplete="username" errors={fieldErrors.email} />
      <Button type="submit" variant="primary" className="w-full" disabled={pending}>
        Send reset link
      </Button>
      <p className="text-center text-xs">
        <Link href="/sign-in" className="text-accent hover:underline">
          Back to sign-in
        </Link>
      </p>
    </form>
  );
}
