"use client";

import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import type { SensorChannel } from "@/lib/domain/types";
import { CHANNEL_DIRECTIONS, CHANNEL_QUANTITIES } from "@/lib/domain/types";
import { useFormAction } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { FieldError, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Table, Td, Th } from "@/components/ui/table";
import { addChannelAction, deactivateChannelAction, updateChannelAction } from "../../actions";

const cell = cx(inputClass, "h-8 px-2");

function errorsFor(fe: Record<string, string[]>, ...keys: string[]): string[] | undefined {
  for (const k of keys) if (fe[k]?.length) return fe[k];
  return undefined;
}

/** One input cell bound to the row's form (`form` attribute), with its messages under it. */
function Cell({ formId, name, label, defaultValue, errors, className, type = "text" }: {
  formId: string; name: string; label: string; defaultValue: string; errors?: string[]; className?: string; type?: string;
}) {
  return (
    <Td className={cx("align-top", className)}>
      <input
        form={formId}
        name={name}
        type={type}
        aria-label={label}
        defaultValue={defaultValue}
        aria-invalid={Boolean(errors?.length)}
        className={cell}
        step={type === "number" ? "any" : undefined}
      />
      <FieldError id={`${formId}-${name}-error`} messages={errors} />
    </Td>
  );
}

function SelectCell({ formId, name, label, defaultValue, options, errors }: {
  formId: string; name: string; label: string; defaultValue: string; options: readonly string[]; errors?: string[];
}) {
  return (
    <Td className="min-w-24 align-top">
      <select form={formId} name={name} aria-label={label} defaultValue={defaultValue} aria-invalid={Boolean(errors?.length)} className={cell}>
        {options.map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
      <FieldError id={`${formId}-${name}-error`} messages={errors} />
    </Td>
  );
}

/** A row in edit mode (existing channel) or the "add" row (no channel). */
function EditRow({ assetId, channel, onDone }: { assetId: string; channel?: SensorChannel; onDone: () => void }) {
  const router = useRouter();
  const { state, onSubmit, pending, fieldErrors: fe, message } = useFormAction(channel ? updateChannelAction : addChannelAction);
  const formId = channel ? `channel-${channel.id}` : "channel-new";
  const handled = useRef<unknown>(null);
  useEffect(() => {
    if (state?.ok && handled.current !== state) {
      handled.current = state;
      onDone();
      router.refresh();
    }
  }, [state, onDone, router]);
  const p = channel?.positionM;
  return (
    <>
      <tr className="bg-accent-soft/40" data-channel-edit={channel?.code ?? "new"}>
        <Cell formId={formId} name="code" label="Code" defaultValue={channel?.code ?? ""} errors={errorsFor(fe, "code")} className="min-w-28" />
        <Cell formId={formId} name="x" label="x (m)" type="number" defaultValue={p ? String(p.x) : "0"} errors={errorsFor(fe, "positionM.x", "x", "positionM")} />
        <Cell formId={formId} name="y" label="y (m)" type="number" defaultValue={p ? String(p.y) : "0"} errors={errorsFor(fe, "positionM.y", "y")} />
        <Cell formId={formId} name="z" label="z (m)" type="number" defaultValue={p ? String(p.z) : "0"} errors={errorsFor(fe, "positionM.z", "z")} />
        <SelectCell formId={formId} name="direction" label="Direction" defaultValue={channel?.direction ?? "z"} options={CHANNEL_DIRECTIONS} errors={errorsFor(fe, "direction")} />
        <SelectCell formId={formId} name="quantity" label="Quantity" defaultValue={channel?.quantity ?? "acceleration"} options={CHANNEL_QUANTITIES} errors={errorsFor(fe, "quantity")} />
        <Cell formId={formId} name="units" label="Units" defaultValue={channel?.units ?? "m/s2"} errors={errorsFor(fe, "units")} />
        <Cell formId={formId} name="sensitivity" label="Sensitivity" type="number" defaultValue={channel?.sensitivity === null || channel?.sensitivity === undefined ? "" : String(channel.sensitivity)} errors={errorsFor(fe, "sensitivity")} />
        <Td className="align-top">{channel ? (channel.active ? "Active" : "Inactive") : "New"}</Td>
        <Td className="align-top">
          <form id={formId} onSubmit={onSubmit} noValidate className="flex gap-1.5">
            <input type="hidden" name="assetId" value={assetId} />
            {channel ? <input type="hidden" name="channelId" value={channel.id} /> : null}
            <Button type="submit" size="sm" variant="primary" disabled={pending}>
              {channel ? "Save" : "Add"}
            </Button>
            {channel ? (
              <Button size="sm" variant="quiet" onClick={onDone}>
                Cancel
              </Button>
            ) : null}
          </form>
        </Td>
      </tr>
      {message ? (
        <tr>
          <td colSpan={10} className="px-3 pb-2">
            <Notice tone="error">{message}</Notice>
          </td>
        </tr>
      ) : null}
    </>
  );
}

function DeactivateButton({ assetId, channelId, code }: { assetId: string; channelId: string; code: string }) {
  const { onSubmit, pending, message } = useFormAction(deactivateChannelAction, { refreshOnSuccess: true });
  return (
    <form
      onSubmit={(e) => {
        if (!window.confirm(`Deactivate channel ${code}? Uploads may no longer name it.`)) {
          e.preventDefault();
          return;
        }
        onSubmit(e);
      }}
    >
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="channelId" value={channelId} />
      <Button type="submit" size="sm" variant="danger" disabled={pending} title={message ?? undefined}>
        Deactivate
      </Button>
    </form>
  );
}

export function ChannelTable({ assetId, channels, canEdit }: { assetId: string; channels: SensorChannel[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<string | null>(null);
  const [addKey, setAddKey] = useState(0);
  return (
    <Table className="mt-2">
      <thead>
        <tr>
          <Th>Code</Th>
          <Th>x (m)</Th>
          <Th>y (m)</Th>
          <Th>z (m)</Th>
          <Th>Direction</Th>
          <Th>Quantity</Th>
          <Th>Units</Th>
          <Th>Sensitivity</Th>
          <Th>Status</Th>
          {canEdit ? <Th className="w-40"><span className="sr-only">Actions</span></Th> : null}
        </tr>
      </thead>
      <tbody>
        {channels.map((c) =>
          canEdit && editing === c.id ? (
            <EditRow key={c.id} assetId={assetId} channel={c} onDone={() => setEditing(null)} />
          ) : (
            <tr key={c.id} data-channel-row={c.code} className={c.active ? undefined : "text-faint"}>
              <Td className="font-mono text-[13px] font-medium">{c.code}</Td>
              <Td className="tabular-nums">{c.positionM.x}</Td>
              <Td className="tabular-nums">{c.positionM.y}</Td>
              <Td className="tabular-nums">{c.positionM.z}</Td>
              <Td className="font-mono text-[13px]">{c.direction}</Td>
              <Td>{c.quantity}</Td>
              <Td className="font-mono text-[13px]">{c.units}</Td>
              <Td className="tabular-nums">{c.sensitivity ?? "—"}</Td>
              <Td>{c.active ? "Active" : "Inactive"}</Td>
              {canEdit ? (
                <Td>
                  <div className="flex gap-1.5">
                    <Button size="sm" onClick={() => setEditing(c.id)}>
                      Edit
                    </Button>
                    {c.active ? <DeactivateButton assetId={assetId} channelId={c.id} code={c.code} /> : null}
                  </div>
                </Td>
              ) : null}
            </tr>
          ),
        )}
        {channels.length === 0 ? (
          <tr>
            <Td colSpan={canEdit ? 10 : 9} className="py-6 text-center text-muted">
              No channels yet.
            </Td>
          </tr>
        ) : null}
        {canEdit ? <EditRow key={addKey} assetId={assetId} onDone={() => setAddKey((k) => k + 1)} /> : null}
      </tbody>
    </Table>
  );
}
