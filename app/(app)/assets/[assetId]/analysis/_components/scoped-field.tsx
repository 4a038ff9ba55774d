import type { InputHTMLAttributes } from "react";
import { cx } from "@/components/ui/cx";
import { FieldError, inputClass } from "@/components/ui/field";

type Props = Omit<InputHTMLAttributes<HTMLInputElement>, "name" | "id"> & {
  scope: string; label: string; name: string; errors?: string[]; wrapperClassName?: string;
};

/**
 * A text field whose ids carry a scope (`<scope>-<name>`), for forms that repeat on one page
 * (the settings form, the add form and each row's edit form all have band fields).
 */
export function ScopedTextField({ scope, label, name, errors, wrapperClassName, className, ...rest }: Props) {
  const id = `${scope}-${name}`;
  const invalid = Boolean(errors?.length);
  return (
    <div className={cx("min-w-0", wrapperClassName)}>
      <label htmlFor={id} className="mb-1 block text-left text-xs font-medium uppercase tracking-wide text-muted">{label}</label>
      <input id={id} name={name} aria-invalid={invalid} aria-describedby={invalid ? `${id}-error` : undefined} className={cx(inputClass, className)} {...rest} />
      <FieldError id={`${id}-error`} messages={errors} />
    </div>
  );
}
