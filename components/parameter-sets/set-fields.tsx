"use client";

import type { UseFormReturn } from "react-hook-form";
import { FLAG_META, PARAM_GROUP_LABEL, PARAM_META, type ParamMeta } from "@/lib/model/param-meta";
import { Field } from "@/components/ui/text-field";
import type { LabSummary } from "@/lib/contracts/labs";
import { parseTags, type SetFormInput, type SetFormOutput } from "./form-schema";
import { FlagInput } from "./flag-input";
import { ParamInput } from "./param-input";

const GROUPS: ParamMeta["group"][] = ["spins", "optics", "conditions"];

interface SetFieldsProps {
  form: UseFormReturn<SetFormInput, unknown, SetFormOutput>;
  /** Labs the caller may create in; only when creating (a set never moves between labs). */
  labs?: LabSummary[];
}

/** Every editable field of a parameter set: details, then each model parameter by group. */
export function SetFields({ form, labs }: SetFieldsProps) {
  const { register, formState, watch } = form;
  const errors = formState.errors;
  const tags = parseTags(watch("tags") ?? "");

  return (
    <div className="space-y-8">
      <fieldset className="grid gap-4 rounded-lg border border-ink/10 bg-paper-raised p-5 sm:grid-cols-2">
        <legend className="px-1 text-sm font-semibold tracking-wide text-lux-dark uppercase">Details</legend>
        {labs ? (
          <Field id="set-lab" label="Lab" error={errors.labId?.message}>
            {(control) => (
              <select {...control} {...register("labId")}>
                {labs.map((lab) => (
                  <option key={lab.id} value={lab.id}>
                    {lab.name}
                  </option>
                ))}
              </select>
            )}
          </Field>
        ) : null}
        <Field id="set-name" label="Name" error={errors.name?.message} className={labs ? "" : "sm:col-span-2"}>
          {(control) => <input {...control} {...register("name")} />}
        </Field>
        <Field id="set-description" label="Description" error={errors.description?.message} className="sm:col-span-2">
          {(control) => <textarea {...control} rows={3} {...register("description")} />}
        </Field>
        <Field
          id="set-tags"
          label="Tags"
          error={errors.tags?.message}
          hint="Separate tags with commas, e.g. “tgg, room temperature”."
          className="sm:col-span-2"
          after={
            tags.length > 0 ? (
              <ul aria-label="Tags as entered" className="mt-2 flex flex-wrap gap-1">
                {tags.map((tag) => (
                  <li
                    key={tag}
                    className={
                      "max-w-full rounded-full border border-lux/40 bg-lux-light/50 " +
                      "px-2 py-0.5 text-xs text-lux-dark [overflow-wrap:anywhere]"
                    }
                  >
                    {tag}
                  </li>
                ))}
              </ul>
            ) : null
          }
        >
          {(control) => <input {...control} {...register("tags")} />}
        </Field>
      </fieldset>

      {GROUPS.map((group) => (
        <fieldset
          key={group}
          className="grid gap-x-6 gap-y-5 rounded-lg border border-ink/10 bg-paper-raised p-5 sm:grid-cols-2 xl:grid-cols-3"
        >
          <legend className="px-1 text-sm font-semibold tracking-wide text-lux-dark uppercase">{PARAM_GROUP_LABEL[group]}</legend>
          {PARAM_META.filter((meta) => meta.group === group).map((meta) => (
            <ParamInput key={meta.key} meta={meta} control={form.control} />
          ))}
          {FLAG_META.filter((meta) => meta.group === group).map((meta) => (
            <FlagInput key={meta.key} meta={meta} register={register} />
          ))}
        </fieldset>
      ))}
    </div>
  );
}
