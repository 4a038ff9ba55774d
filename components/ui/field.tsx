import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from "react";
import { cx } from "./cx";

export const inputClass =
  "block w-full h-9 rounded-md border border-line-strong bg-surface px-2.5 text-sm text-ink placeholder:text-faint " +
  "focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/20 aria-[invalid=true]:border-danger";

/** Messages for one field, shown under its input. */
export function FieldError({ id, messages }: { id: string; messages?: string[] }) {
  if (!messages || messages.length === 0) return null;
  return (
    <ul id={id} className="mt-1 space-y-0.5 text-xs text-danger" data-field-error>
      {messages.map((m) => (
        <li key={m}>{m}</li>
      ))}
    </ul>
  );
}

interface FieldShellProps {
  label: string;
  name: string;
  hint?: ReactNode;
  errors?: string[];
  className?: string;
  children: ReactNode;
}

/** Label, control, hint and every error message of one form field. */
export function FieldShell({ label, name, hint, errors, className, children }: FieldShellProps) {
  return (
    <div className={cx("min-w-0", className)}>
      <label htmlFor={`f-${name}`} className="mb-1 block text-xs font-medium uppercase tracking-wide text-muted">
        {label}
      </label>
      {children}
      {hint && !errors?.length ? <p className="mt-1 text-xs text-faint">{hint}</p> : null}
      <FieldError id={`f-${name}-error`} messages={errors} />
    </div>
  );
}

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, "name"> & {
  label: string;
  name: string;
  hint?: ReactNode;
  errors?: string[];
  wrapperClassName?: string;
};

export function TextField({ label, name, hint, errors, wrapperClassName, className, ...rest }: TextFieldProps) {
  const invalid = Boolean(errors?.length);
  return (
    <FieldShell label={label} name={name} hint={hint} errors={errors} className={wrapperClassName}>
      <input
        id={`f-${name}`}
        name={name}
        aria-invalid={invalid}
        aria-describedby={invalid ? `f-${name}-error` : undefined}
        className={cx(inputClass, className)}
        {...rest}
      />
    </FieldShell>
  );
}

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, "name"> & {
  label: string;
  name: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  hint?: ReactNode;
  errors?: string[];
  wrapperClassName?: string;
};

export function SelectField({ label, name, options, hint, errors, wrapperClassName, className, ...rest }: SelectFieldProps) {
  const invalid = Boolean(errors?.length);
  return (
    <FieldShell label={label} name={name} hint={hint} errors={errors} className={wrapperClassName}>
      <select
        id={`f-${name}`}
        name={name}
        aria-invalid={invalid}
        aria-describedby={invalid ? `f-${name}-error` : undefined}
        className={cx(inputClass, "pr-8", className)}
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}
