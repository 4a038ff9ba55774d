"use client";

import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { FieldError } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { updateNotificationPrefsAction } from "../actions";

/** One checkbox per asset of the organisation: checked = no alert e-mails about that asset. */
export function NotificationForm({ prefs }: { prefs: { assetId: string; assetName: string; muted: boolean }[] }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(updateNotificationPrefsAction, { refreshOnSuccess: true });
  if (prefs.length === 0) return <p className="text-sm text-muted">The organisation has no asset yet.</p>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" data-testid="notification-form">
      <p className="text-sm text-muted">
        Alert e-mails (raised, assigned to you, closed) come for every asset. Tick an asset to stop them for that asset only;
        its alerts still appear in Alerts.
      </p>
      {state?.ok ? <Notice tone="success">Saved.</Notice> : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      <fieldset>
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-muted">No e-mails about</legend>
        <ul className="divide-y divide-line/70">
          {prefs.map((p) => (
            <li key={p.assetId}>
              <label className="flex min-h-10 cursor-pointer items-center gap-3 py-1.5 text-sm">
                <input type="checkbox" name="muted" value={p.assetId} defaultChecked={p.muted} className="h-4 w-4 accent-[var(--color-accent)]" />
                <span>{p.assetName}</span>
              </label>
            </li>
          ))}
        </ul>
        <FieldError id="f-muted-error" messages={fieldErrors.muted} />
      </fieldset>
      <Button type="submit" variant="primary" disabled={pending}>Save e-mail settings</Button>
    </form>
  );
}
