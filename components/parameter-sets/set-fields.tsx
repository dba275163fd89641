"use client";

import type { UseFormReturn } from "react-hook-form";
import { PARAM_GROUP_LABEL, PARAM_META, type ParamMeta } from "@/lib/model/param-meta";
import { INPUT_CLASS } from "@/components/ui/text-field";
import type { Lab } from "@/lib/query/types";
import { parseTags, type SetFormInput, type SetFormOutput } from "./form-schema";
import { ParamInput } from "./param-input";

const GROUPS: ParamMeta["group"][] = ["spins", "optics", "conditions"];

function FieldError({ id, message }: { id: string; message?: string }) {
  return message ? (
    <p id={id} className="mt-1 text-sm text-ember">
      {message}
    </p>
  ) : null;
}

interface SetFieldsProps {
  form: UseFormReturn<SetFormInput, unknown, SetFormOutput>;
  /** Labs the caller may create in; only when creating (a set never moves between labs). */
  labs?: Lab[];
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
          <div>
            <label htmlFor="set-lab" className="block text-sm font-medium">
              Lab
            </label>
            <select
              id="set-lab"
              aria-invalid={errors.labId ? true : undefined}
              aria-describedby={errors.labId ? "set-lab-error" : undefined}
              className={`mt-1 ${INPUT_CLASS}`}
              {...register("labId")}
            >
              {labs.map((lab) => (
                <option key={lab.id} value={lab.id}>
                  {lab.name}
                </option>
              ))}
            </select>
            <FieldError id="set-lab-error" message={errors.labId?.message} />
          </div>
        ) : null}
        <div className={labs ? "" : "sm:col-span-2"}>
          <label htmlFor="set-name" className="block text-sm font-medium">
            Name
          </label>
          <input
            id="set-name"
            aria-invalid={errors.name ? true : undefined}
            aria-describedby={errors.name ? "set-name-error" : undefined}
            className={`mt-1 ${INPUT_CLASS}`}
            {...register("name")}
          />
          <FieldError id="set-name-error" message={errors.name?.message} />
        </div>
        <div className="sm:col-span-2">
          <label htmlFor="set-description" className="block text-sm font-medium">
            Description
          </label>
          <textarea
            id="set-description"
            rows={3}
            aria-invalid={errors.description ? true : undefined}
            aria-describedby={errors.description ? "set-description-error" : undefined}
            className={`mt-1 ${INPUT_CLASS}`}
            {...register("description")}
          />
          <FieldError id="set-description-error" message={errors.description?.message} />
        </div>
        <div className="sm:col-span-2">
          <label htmlFor="set-tags" className="block text-sm font-medium">
            Tags
          </label>
          <input
            id="set-tags"
            aria-invalid={errors.tags ? true : undefined}
            aria-describedby={`set-tags-hint${errors.tags ? " set-tags-error" : ""}`}
            className={`mt-1 ${INPUT_CLASS}`}
            {...register("tags")}
          />
          <p id="set-tags-hint" className="mt-1 text-xs text-ink-soft">
            Separate tags with commas, e.g. “tgg, room temperature”.
          </p>
          {tags.length > 0 ? (
            <ul aria-label="Tags as entered" className="mt-2 flex flex-wrap gap-1">
              {tags.map((tag) => (
                <li key={tag} className="rounded-full border border-lux/40 bg-lux-light/50 px-2 py-0.5 text-xs text-lux-dark">
                  {tag}
                </li>
              ))}
            </ul>
          ) : null}
          <FieldError id="set-tags-error" message={errors.tags?.message} />
        </div>
      </fieldset>

      {GROUPS.map((group) => (
        <fieldset key={group} className="grid gap-x-6 gap-y-5 rounded-lg border border-ink/10 bg-paper-raised p-5 sm:grid-cols-2 xl:grid-cols-3">
          <legend className="px-1 text-sm font-semibold tracking-wide text-lux-dark uppercase">{PARAM_GROUP_LABEL[group]}</legend>
          {PARAM_META.filter((meta) => meta.group === group).map((meta) => (
            <ParamInput key={meta.key} meta={meta} register={register} error={errors.params?.[meta.key]} />
          ))}
        </fieldset>
      ))}
    </div>
  );
}
