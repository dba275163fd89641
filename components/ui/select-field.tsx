import type { SelectHTMLAttributes } from "react";
import { Field } from "./text-field";

export interface SelectFieldProps extends SelectHTMLAttributes<HTMLSelectElement> {
  id: string;
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled select (see Field); the options are its children. */
export function SelectField({ id, label, error, hint, className = "", children, ...select }: SelectFieldProps) {
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      {(control) => (
        <select {...control} {...select}>
          {children}
        </select>
      )}
    </Field>
  );
}
