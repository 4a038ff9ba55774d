"use client";

import { useRouter } from "next/navigation";
import { useEffect } from "react";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { acceptInvitationAction, acceptInvitationExistingAction } from "../../../actions";

export function AcceptInvitationForm({ token, existingAccount, email }: { token: string; existingAccount: boolean; email: string }) {
  const router = useRouter();
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(existingAccount ? acceptInvitationExistingAction : acceptInvitationAction);
  useEffect(() => {
    if (state?.ok) router.push(`/sign-in?invited=1&email=${encodeURIComponent(state.data.email)}`);
  }, [state, router]);
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="accept-invitation-form">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      {existingAccount ? (
        <>
          {/* The account keeps its name; the service only needs a non-empty value here. */}
          <input type="hidden" name="displayName" value={email} />
          <TextField label="Current password" name="password" type="password" autoComplete="current-password" errors={fieldErrors.password} />
        </>
      ) : (
        <>
          <TextField label="Your name" name="displayName" autoComplete="name" errors={fieldErrors.displayName} />
          <TextField label="Password" name="password" type="password" autoComplete="new-password" errors={fieldErrors.password} hint="At least 12 characters." />
          <TextField label="Repeat password" name="confirmPassword" type="password" autoComplete="new-password" errors={fieldErrors.confirmPassword} />
        </>
      )}
      {fieldErrors.token ? <Notice tone="error">{fieldErrors.token.join(" ")}</Notice> : null}
      <Button type="submit" variant="primary" className="w-full" disabled={pending}>
        {pending ? "Saving…" : existingAccount ? "Join" : "Set password and join"}
      </Button>
    </form>
  );
}
