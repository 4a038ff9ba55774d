"use client";

import type { Member } from "@/lib/domain/types";
import { ROLES } from "@/lib/auth/permissions";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { inputClass } from "@/components/ui/field";
import { formatDate, ROLE_LABELS } from "@/components/ui/format";
import { Table, Td, Th } from "@/components/ui/table";
import { changeMemberRoleAction, removeMemberAction } from "../actions";

export type MemberRow = Omit<Member, "joinedAt"> & { joinedAt: string };

function RoleCell({ member }: { member: MemberRow }) {
  const { onSubmit, pending, message, fieldErrors } = useFormAction(changeMemberRoleAction, { refreshOnSuccess: true });
  const err = message ?? fieldErrors.role?.[0] ?? null;
  return (
    <form onSubmit={onSubmit} className="flex items-center gap-1.5">
      <input type="hidden" name="userId" value={member.userId} />
      <select name="role" defaultValue={member.role} aria-label={`Role of ${member.email}`} className={cx(inputClass, "h-8 w-32")}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </select>
      <Button type="submit" size="sm" disabled={pending}>
        Change
      </Button>
      {err ? <span className="text-xs text-danger" role="alert">{err}</span> : null}
    </form>
  );
}

function RemoveButton({ member }: { member: MemberRow }) {
  const { onSubmit, pending, message } = useFormAction(removeMemberAction, { refreshOnSuccess: true });
  return (
    <form
      onSubmit={(e) => {
        if (!window.confirm(`Remove ${member.displayName || member.email} from the organisation?`)) {
          e.preventDefault();
          return;
        }
        onSubmit(e);
      }}
      className="flex items-center gap-2"
    >
      <input type="hidden" name="userId" value={member.userId} />
      <Button type="submit" size="sm" variant="danger" disabled={pending}>
        Remove
      </Button>
      {message ? <span className="text-xs text-danger" role="alert">{message}</span> : null}
    </form>
  );
}

export function MemberTable({ members, canWrite, selfId, timeZone }: { members: MemberRow[]; canWrite: boolean; selfId: string; timeZone: string }) {
  return (
    <Table>
      <thead>
        <tr>
          <Th>Name</Th>
          <Th>E-mail</Th>
          <Th>Role</Th>
          <Th>Joined</Th>
          {canWrite ? <Th><span className="sr-only">Actions</span></Th> : null}
        </tr>
      </thead>
      <tbody>
        {members.map((m) => (
          <tr key={m.userId} data-member-row={m.email}>
            <Td className="font-medium">
              {m.displayName}
              {m.userId === selfId ? <span className="ml-1.5 text-xs font-normal text-muted">(you)</span> : null}
              {m.disabled ? <span className="ml-1.5 text-xs font-normal text-danger">disabled</span> : null}
            </Td>
            <Td className="text-muted">{m.email}</Td>
            <Td>{canWrite ? <RoleCell member={m} /> : ROLE_LABELS[m.role]}</Td>
            <Td className="tabular-nums text-muted">{formatDate(m.joinedAt, timeZone)}</Td>
            {canWrite ? <Td>{m.userId === selfId ? null : <RemoveButton member={m} />}</Td> : null}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
