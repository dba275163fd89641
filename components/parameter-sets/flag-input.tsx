"use client";

import type { UseFormRegister } from "react-hook-form";
import type { FlagMeta } from "@/lib/model/param-meta";
import type { SetFormInput } from "./form-schema";

/** One model switch (physics-model §5.5): a labelled checkbox with its help text linked. */
export function FlagInput({ meta, register }: { meta: FlagMeta; register: UseFormRegister<SetFormInput> }) {
  const id = `param-${meta.key}`;
  return (
    <div className="sm:col-span-2 xl:col-span-3">
      <div className="flex items-start gap-2">
        <input id={id} type="checkbox" className="mt-1" aria-describedby={`${id}-help`} {...register(`params.${meta.key}`)} />
        <label htmlFor={id} className="text-sm font-medium">
          {meta.label}
        </label>
      </div>
      <p id={`${id}-help`} className="mt-1 text-xs text-ink-soft">
        {meta.help}
      </p>
    </div>
  );
}
