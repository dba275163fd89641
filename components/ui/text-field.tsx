import type { InputHTMLAttributes, ReactNode } from "react";

export const INPUT_CLASS =
  "block w-full rounded-md border border-ink/25 bg-paper-raised px-3 py-2 text-ink placeholder:text-ink-faint " +
  "focus:border-lux aria-[invalid=true]:border-ember disabled:bg-paper-sunk disabled:text-ink-soft";

/** What a field hands its control: the id its label points at, and the links to hint and error. */
export interface FieldControlProps {
  id: string;
  "aria-invalid": true | undefined;
  "aria-describedby": string | undefined;
  className: string;
}

export interface FieldProps {
  id: string;
  label: string;
  error?: string;
  hint?: string;
  className?: string;
  /** Shown between the hint and the error (e.g. the tags as parsed). */
  after?: ReactNode;
  /** The control (input, select, textarea), spread with the props that tie it to label, hint and error. */
  children: (control: FieldControlProps) => ReactNode;
}

/** A labelled control whose hint and error are tied to it through aria-describedby. */
export function Field({ id, label, error, hint, className = "", after, children }: FieldProps) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      {children({ id, "aria-invalid": error ? true : undefined, "aria-describedby": describedBy, className: `mt-1 ${INPUT_CLASS}` })}
      {hint ? (
        <p id={hintId} className="mt-1 text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      {after}
      {error ? (
        <p id={errorId} className="mt-1 text-sm text-ember">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export interface TextFieldProps extends InputHTMLAttributes<HTMLInputElement> {
  id: string;
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled text input (see Field). */
export function TextField({ id, label, error, hint, className = "", ...input }: TextFieldProps) {
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      {(control) => <input {...control} {...input} />}
    </Field>
  );
}
