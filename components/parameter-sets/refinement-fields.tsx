"use client";

import { useState } from "react";
import type { UseFormReturn } from "react-hook-form";
import { Field } from "@/components/ui/text-field";
import { formatAbsorptionText, parseAbsorptionText } from "@/lib/model/absorption-text";
import type { SetFormInput, SetFormOutput } from "./form-schema";

const TABLE_HINT =
  "One row per line: wavelength (nm) and α (1/cm). Inside its range it sets the loss, transmission and figure of merit; empty = none.";

/**
 * The optional refinements: the diamagnetic term's anomaly factor γ and dispersion (physics-model
 * §5.5), and a measured absorption table pasted as text (nm and 1/cm per line). Empty = the default.
 */
export function RefinementFields({ form }: { form: UseFormReturn<SetFormInput, unknown, SetFormOutput> }) {
  const { register, setValue, getValues, formState } = form;
  const stored = getValues("params.absorptionTable");
  const [text, setText] = useState(() => formatAbsorptionText(stored));
  const [tableError, setTableError] = useState<string | null>(null);
  const errors = formState.errors.params as Record<string, { message?: string }> | undefined;
  const orUndefined = (v: unknown) => (v === "" || v === null || v === undefined ? undefined : v);

  return (
    <fieldset className="grid gap-x-6 gap-y-5 rounded-lg border border-ink/10 bg-paper-raised p-5 sm:grid-cols-2">
      <legend className="px-1 text-sm font-semibold tracking-wide text-lux-dark uppercase">Refinements (optional)</legend>
      <Field
        id="param-diamagneticAnomaly"
        label="Diamagnetic anomaly factor γ"
        error={errors?.diamagneticAnomaly?.message}
        hint="Multiplies the diamagnetic term (empty = 1). Fused silica: 0.777, fitted to 3.61 rad/(T·m) at 632.8 nm (Smith 1978)."
      >
        {(control) => (
          <input
            {...control}
            inputMode="decimal"
            {...register("params.diamagneticAnomaly", { setValueAs: (v) => (orUndefined(v) === undefined ? undefined : Number(v)) })}
          />
        )}
      </Field>
      <Field
        id="param-diamagneticDispersion"
        label="Diamagnetic dispersion"
        error={errors?.diamagneticDispersion?.message}
        hint="Whole ε (default) or the host background only, without the paramagnetic ion's own pole."
      >
        {(control) => (
          <select {...control} {...register("params.diamagneticDispersion", { setValueAs: orUndefined })}>
            <option value="">whole ε (default)</option>
            <option value="whole">whole ε</option>
            <option value="host">host background only</option>
          </select>
        )}
      </Field>
      <Field
        id="param-absorptionTable"
        label="Measured absorption α(λ)"
        error={tableError ?? errors?.absorptionTable?.message}
        hint={TABLE_HINT}
        className="sm:col-span-2"
      >
        {(control) => (
          <textarea
            {...control}
            rows={5}
            className={`${control.className} font-mono text-xs`}
            value={text}
            onChange={(e) => {
              setText(e.target.value);
              const parsed = parseAbsorptionText(e.target.value);
              setTableError(parsed.ok ? null : parsed.error);
              // An unreadable table must not save the old one silently: an empty list fails the schema until it is fixed.
              setValue("params.absorptionTable", parsed.ok ? parsed.rows : [], { shouldDirty: true });
            }}
          />
        )}
      </Field>
    </fieldset>
  );
}
