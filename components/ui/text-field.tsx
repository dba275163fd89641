import type { InputHTMLAttributes } from "react";

export interface TextFieldProps extends InputHTMLAttributes<HTMLInputElement> {
  id: string;
  label: string;
  error?: string;
  hint?: string;
}

export const INPUT_CLASS =
  "block w-full rounded-md border border-ink/25 bg-paper-raised px-3 py-2 text-ink placeholder:text-ink-soft/70 focus:border-lux aria-[invalid=true]:border-ember disabled:bg-paper-sunk disabled:text-ink-soft";

/** A labelled input whose hint and error are tied to it through aria-describedby. */
export function TextField({ id, label, error, hint, className = "", ...input }: TextFieldProps) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <input id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={`mt-1 ${INPUT_CLASS}`} {...input} />
      {hint ? (
        <p id={hintId} className="mt-1 text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="mt-1 text-sm text-ember">
          {error}
        </p>
      ) : null}
    </div>
  );
}
