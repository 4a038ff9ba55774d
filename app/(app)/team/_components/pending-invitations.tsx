"use client";

import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { formatDateTime, ROLE_LABELS } from "@/components/ui/format";
import { revokeInvitationAction } from "../actions";

export interface PendingInvitation {
  id: string;
  email: string;
  role: string;
  expiresAt: string;
}

function RevokeInvitation({ id }: { id: string }) {
  const { onSubmit, pending, message } = useFormAction(revokeInvitationAction, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit}>
      <input type="hidden" name="id" value={id} />
      <Button type="submit" size="sm" variant="quiet" disabled={pending} title={message ?? undefined}>
        Withdraw
      </Button>
    </form>
  );
}

/** Invitations sent and not yet accepted; the admin can withdraw one (its link stops working). */
export function PendingInvitations({ invitations, timeZone }: { invitations: PendingInvitation[]; timeZone: string }) {
  if (invitations.length === 0) return <p className="px-4 py-3 text-sm text-muted">None.</p>;
  return (
    <ul className="divide-y divide-line/70">
      {invitations.map((i) => (
        <li key={i.id} className="flex items-center justify-between gap-3 px-4 py-2.5" data-invitation-row={i.email}>
          <div className="min-w-0 text-sm">
            <div className="truncate font-medium">{i.email}</div>
            <div className="text-xs text-muted">
              {ROLE_LABELS[i.role] ?? i.role} · expires {formatDateTime(i.expiresAt, timeZone)}
            </div>
          </div>
          <RevokeInvitation id={i.id} />
        </li>
      ))}
    </ul>
  );
}
