"use client";

import type { FieldError, UseFormRegister } from "react-hook-form";
import type { ParamMeta } from "@/lib/model/param-meta";
import { INPUT_CLASS } from "@/components/ui/text-field";
import type { SetFormInput } from "./form-schema";

/** One model parameter: label, number box with its unit beside it, help text and error, all linked. */
export function ParamInput({ meta, register, error }: { meta: ParamMeta; register: UseFormRegister<SetFormInput>; error?: FieldError }) {
  const id = `param-${meta.key}`;
  const describedBy = [meta.unit ? `${id}-unit` : null, `${id}-help`, error ? `${id}-error` : null].filter(Boolean).join(" ");
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {meta.label}
      </label>
      <div className="mt-1 flex items-center gap-2">
        <input
          id={id}
          type="number"
          step={meta.step}
          inputMode="decimal"
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={`${INPUT_CLASS} tabular-nums`}
          {...register(`params.${meta.key}`, { valueAsNumber: true })}
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
