"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/select-field";
import { roleAtLeast } from "@/lib/contracts/roles";
import { describeError } from "@/lib/query/fetcher";
import { useLabs } from "@/lib/query/labs";
import { useCopyMaterial } from "@/lib/query/materials";

/** "New parameter set from this material": pick a lab the caller edits, create, open the new set. */
export function CopyMaterial({ materialId, materialName }: { materialId: string; materialName: string }) {
  const id = useId();
  const router = useRouter();
  const labs = useLabs();
  const copy = useCopyMaterial(materialId);
  const editable = (labs.data ?? []).filter((l) => roleAtLeast(l.role, "editor"));
  const [labId, setLabId] = useState("");
  const chosen = labId || editable[0]?.id || "";

  if (labs.isPending) return <p className="text-sm text-ink-soft">Loading your labs…</p>;
  if (labs.isError) return <p className="text-sm">Labs could not be loaded: {describeError(labs.error)}</p>;
  if (editable.length === 0)
    return <p className="max-w-xs text-sm text-ink-soft">You are not an editor in any lab, so you cannot copy a material.</p>;

  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        copy.mutate({ labId: chosen }, { onSuccess: (item) => router.push(`/parameter-sets/${item.id}`) });
      }}
    >
      {editable.length > 1 ? (
        <SelectField id={`${id}-lab`} label="Lab" value={chosen} onChange={(e) => setLabId(e.target.value)}>
          {editable.map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </SelectField>
      ) : null}
      <Button type="submit" disabled={copy.isPending || copy.isSuccess} aria-label={`New parameter set from ${materialName}`}>
        {copy.isPending ? "Creating…" : "New parameter set from this material"}
      </Button>
      {copy.isError ? (
        <div className="basis-full">
          <Alert tone="warning" title="Not created">
            {describeError(copy.error)}
          </Alert>
        </div>
      ) : null}
    </form>
  );
}
