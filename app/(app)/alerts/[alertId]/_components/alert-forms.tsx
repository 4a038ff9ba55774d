"use client";

import type { ReactNode } from "react";
import { useFormAction, type ActionResult, type ActionState } from "@/lib/client/use-form-action";
import { Button } from "@/components/ui/button";
import { FieldShell, SelectField, TextField, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { cx } from "@/components/ui/cx";
import {
  acknowledgeAlertAction, assignAlertAction, attachFileAction, closeAlertAction, commentAlertAction, scheduleInspectionAction,
} from "../actions";
import { OUTCOME_LABELS } from "../../_components/labels";

type Act<T> = (prev: ActionState<T>, fd: FormData) => Promise<ActionResult<T>>;

/** One small form: hidden alert id, the fields, a submit button, the answer. */
function ActionForm<T>({ action, alertId, submit, done, variant = "secondary", children, testId }: {
  action: Act<T>; alertId: string; submit: string; done: string; variant?: "primary" | "secondary" | "danger";
  children?: (fieldErrors: Record<string, string[]>) => ReactNode; testId: string;
}) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(action, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" data-testid={testId}>
      <input type="hidden" name="alertId" value={alertId} />
      {children?.(fieldErrors)}
      {message ? <Notice tone="error">{message}</Notice> : null}
      {state?.ok ? <Notice tone="success">{done}</Notice> : null}
      <Button type="submit" variant={variant} disabled={pending} className="w-full sm:w-auto">{submit}</Button>
    </form>
  );
}

function TextArea({ label, name, errors, rows = 3, placeholder }: { label: string; name: string; errors?: string[]; rows?: number; placeholder?: string }) {
  return (
    <FieldShell label={label} name={name} errors={errors}>
      <textarea id={`f-${name}`} name={name} rows={rows} placeholder={placeholder} aria-invalid={Boolean(errors?.length)}
        className={cx(inputClass, "h-auto py-2")} />
    </FieldShell>
  );
}

export function AcknowledgeForm({ alertId }: { alertId: string }) {
  return <ActionForm action={acknowledgeAlertAction} alertId={alertId} submit="Acknowledge" done="Acknowledged." variant="primary" testId="acknowledge-form" />;
}

export function ScheduleForm({ alertId, today }: { alertId: string; today: string }) {
  return (
    <ActionForm action={scheduleInspectionAction} alertId={alertId} submit="Schedule inspection" done="Inspection scheduled." testId="schedule-form">
      {(fe) => (
        <div className="grid gap-3 sm:grid-cols-[12rem_1fr]">
          <TextField label="Inspection date" name="day" type="date" min={today} errors={fe.day} />
          <TextField label="Note (optional)" name="note" maxLength={2000} errors={fe.note} />
        </div>
      )}
    </ActionForm>
  );
}

export function AssignForm({ alertId, inspectors, current }: { alertId: string; inspectors: { userId: string; name: string }[]; current: string | null }) {
  if (inspectors.length === 0) return <p className="text-sm text-muted">The organisation has no inspector to assign.</p>;
  return (
    <ActionForm action={assignAlertAction} alertId={alertId} submit="Assign" done="Assigned." testId="assign-form">
      {(fe) => (
        <SelectField label="Inspector" name="userId" defaultValue={current ?? inspectors[0].userId} errors={fe.userId}
          options={inspectors.map((i) => ({ value: i.userId, label: i.name }))} />
      )}
    </ActionForm>
  );
}

export function CommentForm({ alertId }: { alertId: string }) {
  return (
    <ActionForm action={commentAlertAction} alertId={alertId} submit="Add comment" done="Comment added." testId="comment-form">
      {(fe) => <TextArea label="Comment" name="text" errors={fe.text} />}
    </ActionForm>
  );
}

export function CloseForm({ alertId }: { alertId: string }) {
  return (
    <ActionForm action={closeAlertAction} alertId={alertId} submit="Close alert" done="Alert closed." variant="danger" testId="close-form">
      {(fe) => (
        <>
          <SelectField label="Outcome" name="outcome" defaultValue="" errors={fe.outcome}
            options={[{ value: "", label: "Choose an outcome" }, ...Object.entries(OUTCOME_LABELS).map(([value, label]) => ({ value, label }))]} />
          <TextArea label="Findings" name="findings" rows={4} errors={fe.findings} placeholder="What was inspected and what was found." />
        </>
      )}
    </ActionForm>
  );
}

export function AttachForm({ alertId }: { alertId: string }) {
  return (
    <ActionForm action={attachFileAction} alertId={alertId} submit="Attach" done="File attached." testId="attach-form">
      {(fe) => (
        <FieldShell label="Photo or PDF" name="file" errors={fe.file} hint="JPEG, PNG or WebP photos and PDF documents, up to 10 MiB.">
          <input id="f-file" name="file" type="file" accept="image/jpeg,image/png,image/webp,application/pdf"
            aria-invalid={Boolean(fe.file?.length)} className="block w-full text-sm file:mr-3 file:rounded-md file:border file:border-line-strong file:bg-surface file:px-3 file:py-1.5" />
        </FieldShell>
      )}
    </ActionForm>
  );
}
