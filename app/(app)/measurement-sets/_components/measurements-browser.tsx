"use client";

import { useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { useSearchUpdate } from "@/components/ui/use-search-update";
import { describeError } from "@/lib/query/fetcher";
import { useLabs } from "@/lib/query/labs";
import { useDeleteMeasurementSet, useMeasurementSets } from "@/lib/query/measurement-sets";
import type { MeasurementSetSummary } from "@/lib/contracts/measurement-sets";
import { roleAtLeast } from "@/lib/contracts/roles";
import { parseSort, sortSets, type SortKey } from "./format";
import { MeasurementsTable } from "./measurements-table";
import { UploadPanel } from "./upload-panel";
import { SearchBox } from "@/components/ui/search-box";
import { countOf, noun } from "@/lib/text/plural";

export function MeasurementsBrowser() {
  const searchParams = useSearchParams();
  const update = useSearchUpdate();
  const q = searchParams.get("q") ?? "";
  const labId = searchParams.get("lab") ?? "";
  const sort = parseSort(searchParams.get("sort"), searchParams.get("dir"));

  const labs = useLabs();
  const sets = useMeasurementSets(labId || undefined, q || undefined);
  const editorLabs = useMemo(() => (labs.data ?? []).filter((lab) => roleAtLeast(lab.role, "editor")), [labs.data]);
  const [uploading, setUploading] = useState(false);
  const [uploaded, setUploaded] = useState<string | null>(null);
  const [toDelete, setToDelete] = useState<MeasurementSetSummary | null>(null);
  const remove = useDeleteMeasurementSet();

  const sorted = useMemo(() => sortSets(sets.data ?? [], sort.key, sort.dir), [sets.data, sort.key, sort.dir]);
  const onSort = (key: SortKey) =>
    update({ sort: key, dir: key === sort.key ? (sort.dir === "asc" ? "desc" : "asc") : key === "uploaded" ? "desc" : "asc" });
  const filtered = q !== "" || labId !== "";
  const onSearch = useCallback((text: string) => update({ q: text }), [update]);

  const confirmDelete = () => {
    if (!toDelete) return;
    remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) });
  };

  return (
    <>
      <PageHeader
        title="Measurements"
        lead={
          "Measured rotation and Verdet spectra of your labs. " +
          "Each set keeps its original file; the workbench can lay the points over a prediction."
        }
        actions={
          editorLabs.length > 0 && !uploading ? (
            <Button
              onClick={() => {
                setUploaded(null);
                setUploading(true);
              }}
            >
              Upload measurements
            </Button>
          ) : null
        }
      />

      {uploaded ? (
        <div className="mb-4">
          <Alert tone="success" title="Measurement set stored">
            “{uploaded}” is in the table below. Open a parameter set in the workbench and tick it under “Measured data on the plot”.
          </Alert>
        </div>
      ) : null}

      {uploading ? (
        <UploadPanel
          labs={editorLabs}
          defaultLabId={editorLabs.some((l) => l.id === labId) ? labId : (editorLabs[0]?.id ?? "")}
          onDone={(name) => {
            setUploading(false);
            setUploaded(name);
          }}
          onCancel={() => setUploading(false)}
        />
      ) : null}

      <div className="mb-4 flex flex-wrap items-end gap-4" role="search" aria-label="Filter measurement sets">
        <SearchBox id="measurements-search" placeholder="Name, sample or file" value={q} onSearch={onSearch} />
        <div className="w-full sm:w-60">
          <label htmlFor="measurements-lab" className="block text-sm font-medium">
            Lab
          </label>
          <select
            id="measurements-lab"
            value={labId}
            onChange={(event) => update({ lab: event.target.value })}
            className={`mt-1 ${INPUT_CLASS}`}
          >
            <option value="">All my labs</option>
            {labs.data?.map((lab) => (
              <option key={lab.id} value={lab.id}>
                {lab.name}
              </option>
            ))}
          </select>
        </div>
        {sets.isFetching && !sets.isPending ? (
          <p className="pb-2 text-sm text-ink-soft" role="status">
            Updating…
          </p>
        ) : null}
      </div>

      {sets.isPending ? (
        <SkeletonRows label="Loading measurement sets" />
      ) : sets.isError ? (
        <ErrorPanel error={sets.error} retry={() => void sets.refetch()} />
      ) : sorted.length === 0 ? (
        <div className="rounded-lg border border-dashed border-ink/20 bg-paper-raised px-6 py-10 text-center">
          {filtered ? (
            <>
              <p className="font-medium">No measurement set matches these filters.</p>
              <Button variant="secondary" className="mt-4" onClick={() => update({ q: null, lab: null })}>
                Clear filters
              </Button>
            </>
          ) : (
            <>
              <p className="font-medium">No measurement sets yet</p>
              <p className="mt-1 text-sm text-ink-soft">
                {editorLabs.length > 0
                  ? "Upload a CSV or TSV file of your measured spectrum."
                  : "An editor of your lab can upload the first one; you will see it here."}
              </p>
            </>
          )}
        </div>
      ) : (
        <MeasurementsTable
          items={sorted}
          sortKey={sort.key}
          sortDir={sort.dir}
          onSort={onSort}
          onDelete={(set) => {
            remove.reset();
            setToDelete(set);
          }}
        />
      )}

      <ConfirmDialog
        open={toDelete !== null}
        title="Delete this measurement set?"
        confirmLabel="Delete set"
        destructive
        pending={remove.isPending}
        error={remove.isError ? describeError(remove.error) : null}
        onConfirm={confirmDelete}
        onCancel={() => setToDelete(null)}
      >
        {toDelete ? (
          <p>
            “{toDelete.name}” ({countOf(toDelete.rowCount, noun("row"))}) and its original file {toDelete.fileName} will be removed for
            everyone in {toDelete.labName}. The lab’s audit log keeps a record. This cannot be undone: keep a copy of the file if you may
            need it.
          </p>
        ) : null}
      </ConfirmDialog>
    </>
  );
}

/** Typing updates ?q= once the user pauses, so each keystroke does not become a request. */
