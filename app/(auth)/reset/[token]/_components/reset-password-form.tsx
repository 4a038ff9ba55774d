"use client";

import { useRouter } from "next/navigation";
import { useEffect } from "react";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { resetPasswordAction } from "../../../actions";

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(resetPasswordAction);
  useEffect(() => {
    if (state?.ok) router.push(`/sign-in?reset=1&email=${encodeURIComponent(state.data.email)}`);
  }, [state, router]);
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {message ? <Notice tone="error">{message}</Notice> : null}
      {fieldErrors.token ? <Notice tone="error">{fieldErrors.token.join(" ")}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <TextField label="New password" name="password" type="password" autoComplete="new-password" errors={fieldErrors.password} />
      <TextField label="Repeat new password" name="confirmPassword" type="password" autoComplete="new-password" errors={fieldErrors.confirmPassword} />
      <Button type="submit" variant="primary" className="w-full" disabled={pending}>
        Set new password
      </Button>
    </form>
  );
}
