"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, describeError } from "@/lib/query/fetcher";
import { useLabs } from "@/lib/query/labs";
import { useCreateParameterSet } from "@/lib/query/parameter-sets";
import type { ModelParams } from "@/lib/physics/schema";

/** "Save as new parameter set": name + lab → POST /api/parameter-sets, then open it in the workbench. */
export function SaveAsNew({ params, defaultName }: { params: ModelParams | null; defaultName: string }) {
  const router = useRouter();
  const labs = useLabs();
  const create = useCreateParameterSet();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState(defaultName);
  const [labId, setLabId] = useState("");
  const editable = (labs.data ?? []).filter((l) => l.role === "owner" || l.role === "editor");
  const chosenLab = labId || editable[0]?.id || "";

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!params || !chosenLab || name.trim() === "") return;
    create.mutate(
      { labId: chosenLab, name: name.trim(), description: "Saved from the workbench.", tags: [], params },
      { onSuccess: (item) => router.push(`/workbench/${encodeURIComponent(item.id)}`) },
    );
  };

  if (!open) {
    return (
      <Button variant="secondary" onClick={() => setOpen(true)} disabled={!params} title={params ? undefined : "Fix the flagged inputs first"}>
        Save as new parameter set
      </Button>
    );
  }
  const nameError = create.error instanceof ApiError ? create.error.fields?.name : undefined;
  return (
    <form onSubmit={submit} aria-label="Save as new parameter set" className="flex flex-wrap items-end gap-2 rounded-lg border border-ink/10 bg-paper-raised p-3">
      <div>
        <label htmlFor="save-name" className="block text-sm font-medium">
          Name
        </label>
        <input
          id="save-name"
          className="mt-1 w-56 rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm"
          value={name}
          maxLength={200}
          required
          onChange={(e) => setName(e.target.value)}
          aria-invalid={nameError ? true : undefined}
        />
      </div>
      <div>
        <label htmlFor="save-lab" className="block text-sm font-medium">
          Lab
        </label>
        <select
          id="save-lab"
          className="mt-1 w-48 rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm"
          value={chosenLab}
          onChange={(e) => setLabId(e.target.value)}
          disabled={labs.isPending || editable.length === 0}
        >
          {editable.map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" disabled={create.isPending || !params || !chosenLab}>
        {create.isPending ? "Saving…" : "Save"}
      </Button>
      <Button variant="quiet" onClick={() => setOpen(false)}>
        Close
      </Button>
      {labs.isSuccess && editable.length === 0 ? (
        <p className="w-full text-xs text-ember">You are not an editor in any lab, so you cannot create parameter sets.</p>
      ) : null}
      {labs.isError ? <p className="w-full text-xs text-ember">{describeError(labs.error)}</p> : null}
      {create.isError ? (
        <div className="w-full">
          <Alert tone="warning">{nameError ?? describeError(create.error)}</Alert>
        </div>
      ) : null}
    </form>
  );
}
