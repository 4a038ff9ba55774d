"use client";

import type { GatewayJson } from "@/lib/domain/types";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { formatDateTime } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { SecretOnce } from "@/components/ui/secret-once";
import { Table, Td, Th } from "@/components/ui/table";
import { createGatewayAction, revokeGatewayAction } from "../../actions";

function CreateGatewayForm({ assetId }: { assetId: string }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(createGatewayAction, { refreshOnSuccess: true });
  return (
    <div className="space-y-3 border-t border-line p-4">
      <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3">
        <input type="hidden" name="assetId" value={assetId} />
        <TextField label="New gateway name" name="name" placeholder="e.g. Deck cabinet logger" errors={fieldErrors.name} wrapperClassName="w-72" />
        <Button type="submit" variant="primary" className="mt-5" disabled={pending}>
          Create gateway
        </Button>
      </form>
      {message ? <Notice tone="error">{message}</Notice> : null}
      {state?.ok ? <SecretOnce label={`Device key for ${state.data.gateway.name}`} secret={state.data.key} /> : null}
    </div>
  );
}

function RevokeButton({ assetId, gateway }: { assetId: string; gateway: GatewayJson }) {
  const { onSubmit, pending, message } = useFormAction(revokeGatewayAction, { refreshOnSuccess: true });
  return (
    <form
      onSubmit={(e) => {
        if (!window.confirm(`Revoke the key of ${gateway.name}? The device can no longer upload.`)) {
          e.preventDefault();
          return;
        }
        onSubmit(e);
      }}
    >
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="gatewayId" value={gateway.id} />
      <Button type="submit" size="sm" variant="danger" disabled={pending} title={message ?? undefined}>
        Revoke
      </Button>
    </form>
  );
}

export function GatewayList({ assetId, gateways, canEdit, timeZone }: { assetId: string; gateways: GatewayJson[]; canEdit: boolean; timeZone: string }) {
  return (
    <div>
      <Table>
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>Key</Th>
            <Th>Created</Th>
            <Th>Last seen</Th>
            <Th>Status</Th>
            {canEdit ? <Th><span className="sr-only">Actions</span></Th> : null}
          </tr>
        </thead>
        <tbody>
          {gateways.map((g) => (
            <tr key={g.id} data-gateway-row={g.name} className={g.revokedAt ? "text-faint" : undefined}>
              <Td className="font-medium">{g.name}</Td>
              <Td className="font-mono text-[13px]">{g.keyPrefix}…</Td>
              <Td className="tabular-nums">{formatDateTime(g.createdAt, timeZone)}</Td>
              <Td className="tabular-nums">{g.lastSeenAt ? formatDateTime(g.lastSeenAt, timeZone) : "Never"}</Td>
              <Td>{g.revokedAt ? `Revoked ${formatDateTime(g.revokedAt, timeZone)}` : "In service"}</Td>
              {canEdit ? <Td>{g.revokedAt ? null : <RevokeButton assetId={assetId} gateway={g} />}</Td> : null}
            </tr>
          ))}
          {gateways.length === 0 ? (
            <tr>
              <Td colSpan={canEdit ? 6 : 5} className="py-6 text-center text-muted">
                No gateways yet.
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
      <p className="px-4 py-2 text-xs text-faint">Times in {timeZone}. Keys are stored only as hashes; the full key is shown once, when created.</p>
      {canEdit ? <CreateGatewayForm assetId={assetId} /> : null}
    </div>
  );
}
