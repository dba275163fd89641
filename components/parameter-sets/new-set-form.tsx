"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button, LinkButton } from "@/components/ui/button";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { useCreateParameterSet } from "@/lib/query/parameter-sets";
import type { LabSummary } from "@/lib/contracts/labs";
import { setFormResolver, showServerError, toFormValues, type SetFormInput, type SetFormOutput } from "./form-schema";
import { SetFields } from "./set-fields";
import { useGuardedRouter, useUnsavedGuard } from "./use-unsaved-guard";

/** A new set starts from the terbium-garnet defaults in the first lab the caller can edit. */
export function NewSetForm({ labs, initialLabId }: { labs: LabSummary[]; initialLabId?: string }) {
  const router = useGuardedRouter();
  const create = useCreateParameterSet();
  const [generalError, setGeneralError] = useState<string | null>(null);
  const labId = labs.some((l) => l.id === initialLabId) ? initialLabId! : (labs[0]?.id ?? "");

  const form = useForm<SetFormInput, unknown, SetFormOutput>({
    defaultValues: toFormValues({ labId, name: "", description: "", tags: [], params: TERBIUM_GARNET_DEFAULTS }),
    resolver: setFormResolver,
    mode: "onTouched",
  });
  const guard = useUnsavedGuard(form.formState.isDirty && !create.isSuccess);

  const onSubmit = form.handleSubmit((values) => {
    setGeneralError(null);
    create.mutate(values, {
      onSuccess: (item) => {
        guard.release();
        router.push(`/parameter-sets/${item.id}`);
      },
      onError: (error) => setGeneralError(showServerError(form, error)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6">
      {generalError ? (
        <Alert tone="warning" title="Not created">
          {generalError}
        </Alert>
      ) : null}
      <SetFields form={form} labs={labs} />
      <div className="sticky bottom-0 flex justify-end gap-2 border-t border-ink/10 bg-paper/95 py-3 backdrop-blur">
        <LinkButton variant="secondary" href="/parameter-sets">
          Cancel
        </LinkButton>
        <Button type="submit" disabled={create.isPending || create.isSuccess}>
          {create.isPending ? "Creating…" : "Create parameter set"}
        </Button>
      </div>
      {guard.dialog}
    </form>
  );
}
