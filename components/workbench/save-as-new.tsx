"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { NAME_MAX, setNameSchema } from "@/lib/contracts/parameter-sets";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useLabs } from "@/lib/query/labs";
import { useCreateParameterSet } from "@/lib/query/parameter-sets";
import type { ModelParams } from "@/lib/physics/schema";

/**
 * "Save as new parameter set": name + lab → POST /api/parameter-sets, then open it in the workbench.
 * Offered only to someone who can save somewhere (an editor or owner of at least one lab, which
 * includes their personal lab); the name is checked with the API's own schema as it is typed.
 */
export function SaveAsNew({ params, defaultName }: { params: ModelParams | null; defaultName: string }) {
  const router = useRouter();
  const labs = useLabs();
  const create = useCreateParameterSet();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState(defaultName);
  const [labId, setLabId] = useState("");
  const [tried, setTried] = useState(false);
  const editable = (labs.data ?? []).filter((l) => l.role === "owner" || l.role === "editor");
  const chosenLab = labId || editable[0]?.id || "";
  const nameCheck = setNameSchema.safeParse(name);
  const clientNameError = nameCheck.success ? undefined : nameCheck.error.issues[0]?.message;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTried(true);
    if (!params || !chosenLab || !nameCheck.success) return;
    create.mutate(
      { labId: chosenLab, name: nameCheck.data, description: "Saved from the workbench.", tags: [], params },
      { onSuccess: (item) => router.push(`/workbench/${encodeURIComponent(item.id)}`) },
    );
  };

  // Nothing to offer until we know where the user may save, and nothing at all if nowhere.
  if (!labs.isSuccess || editable.length === 0) {
    return labs.isError ? <p className="text-xs text-ember">{describeError(labs.error)}</p> : null;
  }

  if (!open) {
    return (
      <Button
        variant="secondary"
        onClick={() => setOpen(true)}
        disabled={!params}
        title={params ? undefined : "Fix the flagged inputs first"}
      >
        Save as new parameter set
      </Button>
    );
  }
  // A server message about the name belongs to the name that was sent; typing replaces it.
  const serverNameError = create.error instanceof RequestError ? create.error.fields?.name : undefined;
  const nameError = (tried ? clientNameError : undefined) ?? serverNameError;
  const otherError = create.isError && !serverNameError ? describeError(create.error) : null;
  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label="Save as new parameter set"
      className="flex flex-wrap items-end gap-2 rounded-lg border border-ink/10 bg-paper-raised p-3"
    >
      <div>
        <label htmlFor="save-name" className="block text-sm font-medium">
          Name
        </label>
        <input
          id="save-name"
          className={
            "mt-1 w-56 max-w-full rounded-md border border-ink/25 bg-paper-raised " +
            "px-2.5 py-1.5 text-sm aria-[invalid=true]:border-ember"
          }
          value={name}
          maxLength={NAME_MAX}
          required
          onChange={(e) => {
            setName(e.target.value);
            if (create.isError) create.reset();
          }}
          aria-invalid={nameError ? true : undefined}
          aria-describedby={nameError ? "save-name-error" : undefined}
        />
      </div>
      <div>
        <label htmlFor="save-lab" className="block text-sm font-medium">
          Lab
        </label>
        <select
          id="save-lab"
          className="mt-1 w-48 max-w-full rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm"
          value={chosenLab}
          onChange={(e) => setLabId(e.target.value)}
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
      {nameError ? (
        <p id="save-name-error" className="w-full text-sm text-ember">
          {nameError}
        </p>
      ) : null}
      {otherError ? (
        <div className="w-full">
          <Alert tone="warning">{otherError}</Alert>
        </div>
      ) : null}
    </form>
  );
}
