"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { parameterSetQuery, useDeleteParameterSet, useUpdateParameterSet } from "@/lib/query/parameter-sets";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";
import { mergeOntoNewer } from "@/lib/model/merge";
import { formatIssues, modelParamsSchema } from "@/lib/physics/schema";
import { ConflictBanner, type MergePreview } from "./conflict-banner";
import { setFormResolver, showServerError, toFormValues, type SetFormInput, type SetFormOutput } from "./form-schema";
import { SetFields } from "./set-fields";
import { useGuardedRouter, useUnsavedGuard } from "./use-unsaved-guard";
import { INPUT_CLASS } from "@/components/ui/text-field";

function currentFromConflict(error: RequestError): ParameterSet | null {
  const body = error.body as { error?: { current?: ParameterSet }; current?: ParameterSet } | null;
  return body?.error?.current ?? body?.current ?? null;
}

/**
 * Edits one set. `base` is the server version the form was loaded from; saves send its number, so
 * a save over someone else's newer version is refused (409) instead of silently replacing it.
 */
export function SetEditor({ initial }: { initial: ParameterSet }) {
  const router = useGuardedRouter();
  const queryClient = useQueryClient();
  const [base, setBase] = useState(initial);
  const [conflict, setConflict] = useState<ParameterSet | null>(null);
  const [generalError, setGeneralError] = useState<string | null>(null);
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  // Why this save, stored with the version it makes and shown in the history; cleared once saved.
  const [note, setNote] = useState("");
  const [preview, setPreview] = useState<(MergePreview & { params: SetFormOutput["params"] | null; error: string | null }) | null>(null);

  const form = useForm<SetFormInput, unknown, SetFormOutput>({
    defaultValues: toFormValues(initial),
    resolver: setFormResolver,
    mode: "onTouched",
  });
  const update = useUpdateParameterSet(initial.id);
  const remove = useDeleteParameterSet(initial.id);
  const guard = useUnsavedGuard(form.formState.isDirty);

  const loadServerVersion = (item: ParameterSet) => {
    setBase(item);
    setConflict(null);
    setPreview(null);
    form.reset(toFormValues(item));
  };

  const save = (values: SetFormOutput, version: number) => {
    setGeneralError(null);
    setSavedVersion(null);
    update.mutate(
      {
        version,
        name: values.name,
        description: values.description,
        tags: values.tags,
        params: values.params,
        note: note.trim() || undefined,
      },
      {
        onSuccess: (item) => {
          setNote("");
          loadServerVersion(item);
          setSavedVersion(item.version);
        },
        onError: async (error) => {
          if (error instanceof RequestError && error.code === "stale_version") {
            const current =
              currentFromConflict(error) ?? (await queryClient.fetchQuery({ ...parameterSetQuery(initial.id), staleTime: 0 }));
            setConflict(current);
            setPreview(null);
            return;
          }
          setGeneralError(showServerError(form, error));
        },
      },
    );
  };

  const onSave = form.handleSubmit((values) => save(values, base.version));
  // Only this user's changes (form vs. the version they started from) go on top of the newer version.
  const onPreviewMerge = form.handleSubmit((values) => {
    if (!conflict) return;
    const { merged, mine, clashes } = mergeOntoNewer({ base, mine: values, theirs: conflict });
    const checked = modelParamsSchema.safeParse(merged.params);
    setPreview({
      merged,
      mine,
      clashes,
      params: checked.success ? checked.data : null,
      error: checked.success
        ? null
        : `The merged values cannot be saved together: ${formatIssues(checked.error).join("; ")}. Edit the form, then try again.`,
    });
  });
  const onSaveMerged = () => {
    if (!conflict || !preview?.params) return;
    const { merged } = preview;
    save(
      { labId: conflict.labId, name: merged.name, description: merged.description, tags: [...merged.tags], params: preview.params },
      conflict.version,
    );
  };

  return (
    <form onSubmit={onSave} noValidate className="space-y-6">
      {conflict ? (
        <ConflictBanner
          current={conflict}
          mine={form.watch()}
          pending={update.isPending}
          preview={preview}
          previewError={preview?.error ?? null}
          onPreviewMerge={() => void onPreviewMerge()}
          onCancelMerge={() => setPreview(null)}
          onSaveMerged={onSaveMerged}
          onDiscard={() => loadServerVersion(conflict)}
        />
      ) : null}
      {generalError ? (
        <Alert tone="warning" title="Not saved">
          {generalError}
        </Alert>
      ) : null}
      {savedVersion !== null && !form.formState.isDirty ? <Alert tone="success">Saved as version {savedVersion}.</Alert> : null}

      <SetFields form={form} />

      <div
        className={
          "sticky bottom-0 flex flex-wrap items-center justify-between gap-3 border-t border-ink/10 bg-paper/95 py-3 backdrop-blur"
        }
      >
        <p className="text-sm text-ink-soft" aria-live="polite">
          {form.formState.isDirty ? "Unsaved changes" : `Showing version ${base.version}`}
        </p>
        <div className="flex flex-wrap items-center gap-2">
          <label htmlFor="version-note" className="sr-only">
            Note for this version (optional)
          </label>
          <input
            id="version-note"
            type="text"
            maxLength={500}
            value={note}
            onChange={(e) => setNote(e.target.value)}
            placeholder="Note for this version (optional)"
            className={`w-64 max-w-full ${INPUT_CLASS}`}
          />
          <Button variant="danger" onClick={() => setConfirmDelete(true)}>
            Delete
          </Button>
          <Button type="submit" disabled={update.isPending || conflict !== null}>
            {update.isPending ? "Saving…" : "Save"}
          </Button>
        </div>
      </div>

      <ConfirmDialog
        open={confirmDelete}
        title={`Delete “${base.name}”?`}
        confirmLabel="Delete parameter set"
        destructive
        pending={remove.isPending}
        error={remove.isError ? describeError(remove.error) : null}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() =>
          remove.mutate(undefined, {
            onSuccess: () => {
              guard.release();
              form.reset(form.getValues());
              router.push("/parameter-sets");
            },
          })
        }
      >
        The set and all its versions disappear for everyone in the lab. The audit log keeps a record that it existed.
      </ConfirmDialog>
      {guard.dialog}
    </form>
  );
}
