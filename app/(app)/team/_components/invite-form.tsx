"use client";

import { useEffect, useRef, useState } from "react";
import { ROLES } from "@/lib/auth/permissions";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { ROLE_LABELS } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { inviteMemberAction } from "../actions";

const ROLE_HINTS: Record<string, string> = {
  admin: "Everything, plus members, invitations and gateway keys.",
  engineer: "Assets, sensor layouts, baselines, alarm settings.",
  inspector: "Views everything; works and closes alerts.",
  owner: "Views the map, assets and reports; changes nothing.",
};

export function InviteForm() {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(inviteMemberAction);
  const [role, setRole] = useState("inspector");
  const [formKey, setFormKey] = useState(0);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const handled = useRef<unknown>(null);
  useEffect(() => {
    if (state?.ok && handled.current !== state) {
      handled.current = state;
      setSentTo(state.data.email);
      setFormKey((k) => k + 1);
    }
  }, [state]);
  return (
    <form key={formKey} onSubmit={onSubmit} noValidate className="space-y-4" data-testid="invite-form">
      {sentTo ? <Notice tone="success">Invitation sent to {sentTo}.</Notice> : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      <TextField label="E-mail" name="email" type="email" autoComplete="off" errors={fieldErrors.email} />
      <SelectField
        label="Role"
        name="role"
        value={role}
        onChange={(e) => setRole(e.target.value)}
        options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
        errors={fieldErrors.role}
        hint={ROLE_HINTS[role]}
      />
      <Button type="submit" variant="primary" disabled={pending}>
        {pending ? "Sending…" : "Send invitation"}
      </Button>
      <p className="text-xs text-faint">The link in the e-mail lets them choose a password; it expires after a few days.</p>
    </form>
  );
}
