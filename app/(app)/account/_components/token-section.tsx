"use client";

import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { formatDateTime } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { SecretOnce } from "@/components/ui/secret-once";
import { Table, Td, Th } from "@/components/ui/table";
import { createApiTokenAction, revokeApiTokenAction } from "../actions";

export interface TokenRow {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

function RevokeTokenButton({ token }: { token: TokenRow }) {
  const { onSubmit, pending } = useFormAction(revokeApiTokenAction, { refreshOnSuccess: true });
  return (
    <form
      onSubmit={(e) => {
        if (!window.confirm(`Revoke the token "${token.name}"? Scripts using it stop working.`)) {
          e.preventDefault();
          return;
        }
        onSubmit(e);
      }}
    >
      <input type="hidden" name="id" value={token.id} />
      <Button type="submit" size="sm" variant="danger" disabled={pending}>
        Revoke
      </Button>
    </form>
  );
}

export function TokenSection({ tokens, timeZone }: { tokens: TokenRow[]; timeZone: string }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(createApiTokenAction, { refreshOnSuccess: true });
  return (
    <div className="space-y-4">
      <p className="text-xs text-muted">
        Scripts send a token as <code className="font-mono">Authorization: Bearer …</code> to <code className="font-mono">/api/v1</code>; it acts with your role in this organisation.
      </p>
      <Table>
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>Token</Th>
            <Th>Last used</Th>
            <Th><span className="sr-only">Actions</span></Th>
          </tr>
        </thead>
        <tbody>
          {tokens.map((t) => (
            <tr key={t.id} className={t.revokedAt ? "text-faint" : undefined} data-token-row={t.name}>
              <Td className="font-medium">{t.name}</Td>
              <Td className="font-mono text-[13px]">{t.prefix}…</Td>
              <Td className="tabular-nums">{t.lastUsedAt ? formatDateTime(t.lastUsedAt, timeZone) : "Never"}</Td>
              <Td>{t.revokedAt ? "Revoked" : <RevokeTokenButton token={t} />}</Td>
            </tr>
          ))}
          {tokens.length === 0 ? (
            <tr>
              <Td colSpan={4} className="py-4 text-center text-muted">
                No tokens.
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
      <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3">
        <TextField label="New token name" name="name" placeholder="e.g. nightly export" errors={fieldErrors.name} wrapperClassName="w-64" />
        <Button type="submit" variant="primary" className="mt-5" disabled={pending}>
          Create token
        </Button>
      </form>
      {message ? <Notice tone="error">{message}</Notice> : null}
      {state?.ok ? <SecretOnce label={`Token "${state.data.name}"`} secret={state.data.token} /> : null}
    </div>
  );
}
