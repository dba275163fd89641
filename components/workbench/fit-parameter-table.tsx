"use client";

import { INPUT_CLASS } from "@/components/ui/text-field";
import type { FreeableKey } from "@/lib/analysis/definition";
import { PARAM_META } from "@/lib/model/param-meta";
import type { ModelParams } from "@/lib/physics/schema";
import type { ParamDraft } from "@/lib/workbench/fit-draft";
import { fmt } from "@/lib/workbench/format";

/*
 * The fit panel's parameter table: which parameters are free, their bounds, and a Gaussian prior
 * (mean ± σ) on any of them. A prior on a held parameter makes it a nuisance the fit varies within
 * its prior, so every σ and interval carries that uncertainty instead of resting on a fixed value.
 */

const META = new Map(PARAM_META.map((m) => [m.key, m]));

function NumberCell({
  label,
  value,
  disabled,
  invalid,
  placeholder,
  onChange,
}: {
  label: string;
  value: string;
  disabled?: boolean;
  invalid: boolean;
  placeholder: string;
  onChange: (value: string) => void;
}) {
  return (
    <td className="py-1 pr-2">
      <input
        className={`${INPUT_CLASS} w-24 py-1`}
        aria-label={label}
        aria-invalid={invalid ? true : undefined}
        inputMode="decimal"
        disabled={disabled}
        value={value}
        placeholder={placeholder}
        onChange={(e) => onChange(e.target.value)}
      />
    </td>
  );
}

export function FitParameterTable({
  keys,
  drafts,
  params,
  errors,
  onChange,
}: {
  keys: readonly FreeableKey[];
  drafts: Record<FreeableKey, ParamDraft>;
  params: ModelParams | null;
  errors: Partial<Record<FreeableKey, string>>;
  onChange: (key: FreeableKey, patch: Partial<ParamDraft>) => void;
}) {
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[34rem] text-sm">
        <caption className="pb-1 text-left text-xs text-ink-soft">
          Bounds apply to free parameters. A prior (mean ± σ; the mean defaults to the start) adds ((x − mean)/σ)² to χ² and may sit on a
          held parameter too.
        </caption>
        <thead>
          <tr className="text-left text-xs text-ink-soft">
            <th className="py-1 pr-2 font-medium">Free</th>
            <th className="py-1 pr-2 font-medium">Parameter</th>
            <th className="py-1 pr-2 font-medium">Start</th>
            <th className="py-1 pr-2 font-medium">Lower bound</th>
            <th className="py-1 pr-2 font-medium">Upper bound</th>
            <th className="py-1 pr-2 font-medium">Prior mean</th>
            <th className="py-1 font-medium">Prior σ</th>
          </tr>
        </thead>
        <tbody>
          {keys.map((key) => {
            const meta = META.get(key);
            const label = `${meta?.label ?? key}${meta?.unit ? ` (${meta.unit})` : ""}`;
            const d = drafts[key];
            const error = errors[key];
            return (
              <tr key={key} className="border-t border-ink/10 align-top">
                <td className="py-1 pr-2">
                  <input
                    type="checkbox"
                    aria-label={`Free ${label}`}
                    checked={d.free}
                    onChange={(e) => onChange(key, { free: e.target.checked })}
                  />
                </td>
                <td className="py-1 pr-2">
                  {label}
                  {error ? (
                    <p className="text-xs text-ember" role="alert">
                      {error}
                    </p>
                  ) : null}
                </td>
                <td className="py-1 pr-2 tabular-nums">{fmt(params?.[key])}</td>
                <NumberCell
                  label={`Lower bound of ${label}`}
                  value={d.min}
                  disabled={!d.free}
                  invalid={Boolean(error)}
                  placeholder="none"
                  onChange={(min) => onChange(key, { min })}
                />
                <NumberCell
                  label={`Upper bound of ${label}`}
                  value={d.max}
                  disabled={!d.free}
                  invalid={Boolean(error)}
                  placeholder="none"
                  onChange={(max) => onChange(key, { max })}
                />
                <NumberCell
                  label={`Prior mean of ${label}`}
                  value={d.priorMean}
                  invalid={Boolean(error)}
                  placeholder="start"
                  onChange={(priorMean) => onChange(key, { priorMean })}
                />
                <NumberCell
                  label={`Prior σ of ${label}`}
                  value={d.priorSigma}
                  invalid={Boolean(error)}
                  placeholder="none"
                  onChange={(priorSigma) => onChange(key, { priorSigma })}
                />
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
