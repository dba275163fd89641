"use client";

import { useState } from "react";
import { useController, type Control } from "react-hook-form";
import type { ParamMeta } from "@/lib/model/param-meta";
import { formatNumberInput, numberBoxText, parseDecimal } from "@/lib/model/number-text";
import { INPUT_CLASS } from "@/components/ui/text-field";
import type { ParamBoxValue, SetFormInput } from "./form-schema";

function boxValue(text: string): ParamBoxValue {
  const parsed = parseDecimal(text);
  if (parsed.kind === "number") return parsed.value;
  return parsed.kind === "empty" ? Number.NaN : text;
}

function sameBoxValue(a: unknown, b: unknown): boolean {
  return Object.is(a, b);
}

/**
 * One model parameter: label, number box with its unit beside it, help text and error, all linked.
 * A text box rather than type="number": it accepts a decimal comma and keeps what was typed
 * ("1e" says "Not a number" instead of arriving empty), and shows large and small values in
 * scientific form (1e14, not 100000000000000).
 */
export function ParamInput({ meta, control }: { meta: ParamMeta; control: Control<SetFormInput, unknown, unknown> }) {
  const id = `param-${meta.key}`;
  const { field, fieldState } = useController({ control, name: `params.${meta.key}` });
  const error = fieldState.error;
  const value = field.value as ParamBoxValue | undefined;
  const [text, setText] = useState(() => (typeof value === "string" ? value : formatNumberInput(value)));
  const [shown, setShown] = useState<unknown>(value);
  // At display precision until focused; the stored value stays whole (the box edits it in full).
  const [focused, setFocused] = useState(false);
  // The form was reset or loaded another version: show the new value (typing keeps `shown` in step).
  if (!sameBoxValue(shown, value)) {
    setShown(value);
    setText(typeof value === "string" ? value : formatNumberInput(value));
  }
  const describedBy = [meta.unit ? `${id}-unit` : null, `${id}-help`, error ? `${id}-error` : null].filter(Boolean).join(" ");
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {meta.label}
      </label>
      <div className="mt-1 flex items-center gap-2">
        <input
          id={id}
          ref={field.ref}
          name={field.name}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={`${INPUT_CLASS} tabular-nums`}
          value={numberBoxText(text, focused)}
          onFocus={() => setFocused(true)}
          onChange={(event) => {
            const next = boxValue(event.target.value);
            setText(event.target.value);
            setShown(next);
            field.onChange(next);
          }}
          onBlur={() => {
            setFocused(false);
            field.onBlur();
          }}
        />
        <span id={`${id}-unit`} className="w-12 shrink-0 text-sm text-ink-soft">
          {meta.unit}
        </span>
      </div>
      <p id={`${id}-help`} className="mt-1 text-xs text-ink-soft">
        {meta.help}
      </p>
      {error?.message ? (
        <p id={`${id}-error`} className="mt-1 text-sm text-ember">
          {error.message}
        </p>
      ) : null}
    </div>
  );
}
