"use client";

import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { updateProfileAction } from "../actions";

export function ProfileForm({ displayName }: { displayName: string }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(updateProfileAction, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {state?.ok ? <Notice tone="success">Saved.</Notice> : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      <TextField label="Display name" name="displayName" defaultValue={displayName} errors={fieldErrors.displayName} maxLength={120} />
      <Button type="submit" variant="primary" disabled={pending}>
        Save
      </Button>
    </form>
  );
}
