"use client";

import { useEffect, useRef, useState } from "react";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { changePasswordAction } from "../actions";

export function ChangePasswordForm({ email }: { email: string }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(changePasswordAction);
  const [formKey, setFormKey] = useState(0);
  const handled = useRef<unknown>(null);
  useEffect(() => {
    if (state?.ok && handled.current !== state) {
      handled.current = state;
      setFormKey((k) => k + 1);
    }
  }, [state]);
  return (
    <form key={formKey} onSubmit={onSubmit} noValidate className="space-y-4">
      {state?.ok ? <Notice tone="success">Password changed.</Notice> : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <TextField label="Current password" name="currentPassword" type="password" autoComplete="current-password" errors={fieldErrors.currentPassword} />
      <TextField label="New password" name="newPassword" type="password" autoComplete="new-password" errors={fieldErrors.newPassword} hint="At least 12 characters." />
      <TextField label="Repeat new password" name="confirmPassword" type="password" autoComplete="new-password" errors={fieldErrors.confirmPassword} />
      <Button type="submit" variant="primary" disabled={pending}>
        Change password
      </Button>
    </form>
  );
}
