"use client";

import { useRouter } from "next/navigation";
import { startTransition, useActionState, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Table, Td, Th } from "@/components/ui/table";
import { formatDateTime } from "@/components/ui/format";
import type { ActionResult, ActionState } from "@/lib/client/use-form-action";
import { importHistoryAction, previewHistoryAction } from "../actions";

type Preview = Awaited<ReturnType<typeof previewHistoryAction>> extends ActionResult<infer T> ? T : never;
type Imported = Awaited<ReturnType<typeof importHistoryAction>> extends ActionResult<infer T> ? T : never;

const fmt = (v: number | null, digits: number) => (v === null ? "—" : v.toFixed(digits));

/**
 * History import in two steps: choose a CSV and see its preview (rows, modes found or to be
 * created, date range, first rows, every bad row with its line and reason); then confirm.
 * A file with any bad row cannot be confirmed (the import is all or nothing).
 */
export function HistoryImport({ assetId }: { assetId: string }) {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [preview, dispatchPreview, previewing] = useActionState<ActionState<Preview>, FormData>(previewHistoryAction, null);
  const [done, dispatchImport, importing] = useActionState<ActionState<Imported>, FormData>(
    async (prev: ActionState<Imported>, fd: FormData) => {
      const r = await importHistoryAction(prev, fd);
      if (r.ok) router.refresh();
      return r;
    },
    null,
  );
  const [shownFor, setShownFor] = useState<File | null>(null);
  const [importedFor, setImportedFor] = useState<File | null>(null);

  function onPreview(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (!file) return;
    const fd = new FormData();
    fd.set("assetId", assetId);
    fd.set("file", file);
    setShownFor(file);
    setImportedFor(null);
    startTransition(() => dispatchPreview(fd));
  }
  function onConfirm() {
    if (!file || !preview?.ok) return;
    const fd = new FormData();
    fd.set("assetId", assetId);
    fd.set("file", file);
    fd.set("source", preview.data.source);
    setImportedFor(file);
    startTransition(() => dispatchImport(fd));
  }

  // While a preview is running the previous answer (of another file, maybe) is not shown.
  const p = preview?.ok && shownFor === file && !previewing ? preview.data : null;
  const imported = done?.ok && p && importedFor === file ? done.data : null;
  return (
    <div className="space-y-4">
      <form onSubmit={onPreview} className="flex flex-wrap items-end gap-3" aria-label="Choose a history file">
        <label className="min-w-64 text-xs font-medium uppercase tracking-wide text-muted">
          History CSV
          <input
            type="file" name="file" accept=".csv,text/csv" className={`${inputClass} mt-1 pt-1.5`}
            onChange={(e) => setFile(e.currentTarget.files?.[0] ?? null)}
          />
        </label>
        <Button type="submit" variant="secondary" disabled={!file || previewing}>{previewing ? "Checking…" : "Preview"}</Button>
      </form>
      {preview && !preview.ok ? <Notice tone="error">{preview.message}{Object.values(preview.fieldErrors).flat().map((m) => ` ${m}`)}</Notice> : null}

      {p ? (
        <section className="space-y-3" data-testid="history-preview" aria-label="Preview">
          <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
            <div><dt className="text-xs uppercase tracking-wide text-muted">File</dt><dd className="truncate">{p.fileName}</dd></div>
            <div><dt className="text-xs uppercase tracking-wide text-muted">Valid rows</dt><dd data-testid="preview-rows">{p.rows}</dd></div>
            <div>
              <dt className="text-xs uppercase tracking-wide text-muted">Date range (UTC)</dt>
              <dd>{p.from ? `${formatDateTime(p.from, "UTC")} – ${formatDateTime(p.to, "UTC")}` : "—"}</dd>
            </div>
            <div><dt className="text-xs uppercase tracking-wide text-muted">Bad rows</dt><dd data-testid="preview-error-count">{p.errors.length}</dd></div>
          </dl>
          {p.modes.length > 0 ? (
            <div className="text-sm">
              <span className="text-xs uppercase tracking-wide text-muted">Modes </span>
              <ul className="mt-1 flex flex-wrap gap-2" data-testid="preview-modes">
                {p.modes.map((m) => (
                  <li key={m.label} className="rounded border border-line px-2 py-0.5">
                    {m.label}: {m.rows} rows · {m.created ? "new tracked mode" : "existing mode"}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}

          {p.errors.length > 0 ? (
            <div className="space-y-2">
              <Notice tone="error">
                The file has {p.errors.length} bad row(s): nothing can be imported from it. Correct these rows and preview the file again.
              </Notice>
              <Table>
                <thead><tr><Th>Line</Th><Th>Problem</Th></tr></thead>
                <tbody data-testid="preview-errors">
                  {p.errors.map((e) => (
                    <tr key={`${e.line}-${e.reason}`}><Td className="tabular-nums">Line {e.line}</Td><Td>{e.reason}</Td></tr>
                  ))}
                </tbody>
              </Table>
            </div>
          ) : null}

          {p.firstRows.length > 0 ? (
            <div>
              <div className="mb-1 text-xs uppercase tracking-wide text-muted">First rows</div>
              <Table>
                <thead>
                  <tr><Th>Line</Th><Th>Time (UTC)</Th><Th>Mode</Th><Th className="text-right">Frequency (Hz)</Th><Th className="text-right">Damping ratio</Th><Th className="text-right">Temperature (°C)</Th></tr>
                </thead>
                <tbody data-testid="preview-first-rows">
                  {p.firstRows.map((r) => (
                    <tr key={r.line}>
                      <Td className="tabular-nums">{r.line}</Td><Td className="tabular-nums">{r.at.replace(".000Z", "Z")}</Td><Td>{r.mode}</Td>
                      <Td className="text-right tabular-nums">{r.frequencyHz.toFixed(4)}</Td>
                      <Td className="text-right tabular-nums">{fmt(r.dampingRatio, 4)}</Td>
                      <Td className="text-right tabular-nums">{fmt(r.temperatureC, 1)}</Td>
                    </tr>
                  ))}
                </tbody>
              </Table>
            </div>
          ) : null}

          {p.errors.length === 0 && p.rows > 0 ? (
            <div className="space-y-2">
              {p.alreadyImported >= p.rows ? (
                <Notice>This file was imported before: importing it again changes nothing.</Notice>
              ) : null}
              {imported ? (
                <Notice tone="success">
                  Imported {imported.imported} of {imported.rows} rows
                  {imported.imported === 0 ? " (all were already there)" : ""}. The drift statistics are being replayed.
                </Notice>
              ) : (
                <Button variant="primary" onClick={onConfirm} disabled={importing}>
                  {importing ? "Importing…" : `Import ${p.rows} rows`}
                </Button>
              )}
              {done && !done.ok && importedFor === file ? <Notice tone="error">{done.message}</Notice> : null}
            </div>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
