"use client";

import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { FieldError, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Table, Td, Th } from "@/components/ui/table";
import { useFormAction } from "@/lib/client/use-form-action";
import type { ServiceabilityValues } from "@/lib/serviceability/values";
import { setOverrideAction } from "../actions";

type Row = ServiceabilityValues["table"][number];

const withUnit = (v: number, unit: string) => (unit === "–" ? String(v) : `${v} ${unit}`);

function OverrideRow({ assetId, row, canEdit }: { assetId: string; row: Row; canEdit: boolean }) {
  const { onSubmit, pending, fieldErrors, message } = useFormAction(setOverrideAction, { refreshOnSuccess: true });
  const formId = `ov-${row.spec.key}`;
  return (
    <tr data-testid="override-row" data-key={row.spec.key}>
      <Td>{row.spec.label}<div className="text-xs text-faint">{row.spec.source}</div></Td>
      <Td className="whitespace-nowrap">{withUnit(row.spec.defaultValue, row.spec.unit)}</Td>
      <Td className="whitespace-nowrap">
        <strong className={row.overridden ? "text-accent" : undefined}>{withUnit(row.value, row.spec.unit)}</strong>
        {row.overridden ? <div className="text-xs text-muted">override{row.note ? `: ${row.note}` : ""}</div> : null}
      </Td>
      {canEdit ? (
        <Td className="align-top">
          <form id={formId} onSubmit={onSubmit} className="flex items-start gap-2" noValidate>
            <input type="hidden" name="assetId" value={assetId} />
            <input type="hidden" name="key" value={row.spec.key} />
            <div className="w-24">
              <input name="value" aria-label={`${row.spec.label} override`} defaultValue={row.overridden ? String(row.value) : ""} placeholder="default"
                inputMode="decimal" className={cx(inputClass, "h-8 px-2")} aria-invalid={Boolean(fieldErrors.value?.length)} />
              <FieldError id={`${formId}-value-error`} messages={fieldErrors.value} />
            </div>
            <div className="w-48">
              <input name="note" aria-label={`${row.spec.label} note`} defaultValue={row.note ?? ""} placeholder="e.g. national annex" className={cx(inputClass, "h-8 px-2")} />
              <FieldError id={`${formId}-note-error`} messages={fieldErrors.note} />
            </div>
            <Button type="submit" size="sm" disabled={pending}>{pending ? "…" : "Save"}</Button>
          </form>
          {message ? <Notice tone="error" className="mt-1">{message}</Notice> : null}
        </Td>
      ) : null}
    </tr>
  );
}

/** The organisation's serviceability values: default, in force, and (engineers, admins) an override per key; empty removes it. */
export function OverrideTable({ assetId, table, canEdit }: { assetId: string; table: Row[]; canEdit: boolean }) {
  return (
    <Table>
      <thead><tr><Th>Value</Th><Th>Recommended</Th><Th>In force</Th>{canEdit ? <Th>Organisation override (empty = recommended)</Th> : null}</tr></thead>
      <tbody>{table.map((r) => <OverrideRow key={r.spec.key} assetId={assetId} row={r} canEdit={canEdit} />)}</tbody>
    </Table>
  );
}
