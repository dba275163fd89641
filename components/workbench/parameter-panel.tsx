"use client";

import { memo, useState } from "react";
import { numberBoxText } from "@/lib/model/number-text";
import type { ModelParamKey } from "@/lib/physics/schema";
import { FLAG_META, PARAM_GROUP_LABEL, PARAM_META, type ParamMeta } from "@/lib/model/param-meta";
import { PARAM_RANGES } from "@/lib/workbench/param-ranges";
import type { FieldErrors, ParamDrafts } from "@/lib/workbench/validate";

const INPUT =
  "block w-full rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm tabular-nums text-ink " +
  "focus:border-lux aria-[invalid=true]:border-ember aria-[invalid=true]:bg-ember-light/40 disabled:bg-paper-sunk";

const GROUPS: ParamMeta["group"][] = ["conditions", "spins", "optics"];

function ParameterPanelImpl({
  drafts,
  errors,
  onChange,
  readOnlyNote,
}: {
  drafts: ParamDrafts;
  errors: FieldErrors<ModelParamKey>;
  onChange: (key: ModelParamKey, text: string) => void;
  readOnlyNote?: string | null;
}) {
  // Boxes show values at display precision, the one being edited in full (numberBoxText).
  const [focusedKey, setFocusedKey] = useState<ModelParamKey | null>(null);
  return (
    <div className="space-y-5">
      {readOnlyNote ? <p className="text-xs text-ink-soft">{readOnlyNote}</p> : null}
      {GROUPS.map((group) => (
        <fieldset key={group} className="space-y-3">
          <legend className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">{PARAM_GROUP_LABEL[group]}</legend>
          {PARAM_META.filter((m) => m.group === group).map((m) => {
            const id = `param-${m.key}`;
            const error = errors[m.key];
            return (
              <div key={m.key}>
                <div className="flex items-baseline justify-between gap-2">
                  <label htmlFor={id} className="text-sm font-medium">
                    {m.label}
                  </label>
                  <span className="text-xs text-ink-soft">{m.unit}</span>
                </div>
                <input
                  id={id}
                  name={m.key}
                  type="text"
                  inputMode="decimal"
                  autoComplete="off"
                  spellCheck={false}
                  className={`mt-1 ${INPUT}`}
                  value={numberBoxText(drafts[m.key], focusedKey === m.key)}
                  onFocus={() => setFocusedKey(m.key)}
                  onBlur={() => setFocusedKey(null)}
                  aria-invalid={error ? true : undefined}
                  aria-describedby={`${id}-help${error ? ` ${id}-error` : ""}`}
                  onChange={(e) => onChange(m.key, e.target.value)}
                />
                {error ? (
                  <p id={`${id}-error`} className="mt-1 text-xs font-medium text-ember">
                    {m.label} {error}
                  </p>
                ) : null}
                <p id={`${id}-help`} className="mt-1 text-xs leading-snug text-ink-soft">
                  {m.help} <span className="whitespace-nowrap text-ink-faint">Valid: {PARAM_RANGES[m.key].text}.</span>
                </p>
              </div>
            );
          })}
          {FLAG_META.filter((f) => f.group === group).map((f) => (
            <div key={f.key}>
              <label className="flex items-start gap-2 text-sm font-medium">
                <input
                  type="checkbox"
                  name={f.key}
                  className="mt-0.5"
                  checked={drafts[f.key] === "true"}
                  aria-describedby={`param-${f.key}-help`}
                  onChange={(e) => onChange(f.key, e.target.checked ? "true" : "false")}
                />
                {f.label}
              </label>
              <p id={`param-${f.key}-help`} className="mt-1 text-xs leading-snug text-ink-soft">
                {f.help}
              </p>
            </div>
          ))}
        </fieldset>
      ))}
    </div>
  );
}

export const ParameterPanel = memo(ParameterPanelImpl);
