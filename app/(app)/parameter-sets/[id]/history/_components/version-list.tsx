"use client";

import { useState } from "react";
import { FitProvenanceSummary } from "@/components/parameter-sets/fit-provenance";
import { MaterialProvenanceSummary } from "@/components/parameter-sets/material-provenance";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DateTime } from "@/components/ui/date-time";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useRestoreVersion } from "@/lib/query/parameter-sets";
import type { ParameterSetVersion } from "@/lib/contracts/parameter-sets";
import { staleDescriptionValues } from "@/lib/model/diff";

interface VersionListProps {
  setId: string;
  versions: ParameterSetVersion[];
  currentVersion: number;
  canRestore: boolean;
  onRestored: (from: number, to: number) => void;
}

export function VersionList({ setId, versions, currentVersion, canRestore, onRestored }: VersionListProps) {
  const restore = useRestoreVersion(setId);
  const [pick, setPick] = useState<number | null>(null);

  const error =
    restore.error instanceof RequestError && restore.error.code === "stale_version"
      ? "Someone saved a newer version in the meantime. The list is up to date now; check it and restore again if you still want to."
      : restore.isError
        ? describeError(restore.error)
        : null;

  return (
    <section aria-labelledby="versions-title">
      <h2 id="versions-title" className="mb-3 text-lg font-semibold">
        Versions
      </h2>
      <ol aria-labelledby="versions-title" className="space-y-2">
        {versions.map((v) => (
          <li key={v.version} className="rounded-lg border border-ink/10 bg-paper-raised px-4 py-3">
            <div className="flex items-baseline justify-between gap-2">
              <h3 className="font-medium tabular-nums">
                Version {v.version}
                {v.version === currentVersion ? (
                  <span className="ml-2 rounded bg-lux px-1.5 py-0.5 text-xs font-semibold text-white">current</span>
                ) : null}
              </h3>
            </div>
            <p className="mt-0.5 text-sm text-ink-soft">
              <DateTime iso={v.createdAt} /> by {v.createdBy.name}
            </p>
            {v.restoredFrom !== null ? <p className="mt-1 text-sm">Restored from version {v.restoredFrom}.</p> : null}
            {v.note ? <p className="mt-1 text-sm whitespace-pre-line">“{v.note}”</p> : null}
            <StaleDescriptionNote version={v} previous={versions.find((p) => p.version === v.version - 1) ?? null} />
            <FitProvenanceSummary provenance={v.provenance} />
            <MaterialProvenanceSummary provenance={v.provenance} />
            {canRestore && v.version !== currentVersion ? (
              <Button
                variant="secondary"
                className="mt-2"
                onClick={() => {
                  restore.reset();
                  setPick(v.version);
                }}
              >
                Restore this version<span className="sr-only"> (version {v.version})</span>
              </Button>
            ) : null}
          </li>
        ))}
      </ol>
      <ConfirmDialog
        open={pick !== null}
        title={`Restore version ${pick ?? ""}?`}
        confirmLabel="Restore"
        pending={restore.isPending}
        error={error}
        onCancel={() => setPick(null)}
        onConfirm={() => {
          if (pick === null) return;
          restore.mutate(
            { restore: pick, currentVersion },
            {
              onSuccess: (item) => {
                onRestored(pick, item.version);
                setPick(null);
              },
            },
          );
        }}
      >
        This saves a new version {currentVersion + 1} with the content of version {pick}. No version is deleted, so you can go back again.
      </ConfirmDialog>
    </section>
  );
}

/**
 * A version whose description kept a number the save changed (a fit moved κE, the description
 * still quotes the old κE): flagged, so the text is checked before someone trusts it.
 */
function StaleDescriptionNote({ version, previous }: { version: ParameterSetVersion; previous: ParameterSetVersion | null }) {
  if (!previous || version.description !== previous.description) return null;
  const stale = staleDescriptionValues(version.description, previous.params, version.params);
  if (stale.length === 0) return null;
  return (
    <p className="mt-1 rounded border border-ember/40 bg-ember-light px-2 py-1 text-sm">
      The description may be out of date: it still quotes {stale.map((s) => `${s.label} ${s.quoted}`).join(", ")}, which this version
      changed.
    </p>
  );
}
