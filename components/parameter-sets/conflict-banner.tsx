"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { DateTime } from "@/components/ui/date-time";
import { diffSnapshots } from "@/lib/model/diff";
import type { ParameterSet } from "@/lib/query/types";
import { DiffTable } from "./diff-table";
import { formSnapshot, type SetFormInput } from "./form-schema";

interface ConflictBannerProps {
  current: ParameterSet;
  mine: SetFormInput;
  pending: boolean;
  onOverwrite: () => void;
  onDiscard: () => void;
}

/** Someone else saved first: the user's form stays as it is until they choose what to do. */
export function ConflictBanner({ current, mine, pending, onOverwrite, onDiscard }: ConflictBannerProps) {
  const [showDiff, setShowDiff] = useState(false);
  return (
    <section role="alert" aria-labelledby="conflict-title" className="rounded-lg border border-ember bg-ember-light px-5 py-4">
      <h2 id="conflict-title" className="font-semibold">
        Someone saved version {current.version} while you were editing
      </h2>
      <p className="mt-1 text-sm">
        {current.updatedBy.name} saved it on <DateTime iso={current.updatedAt} />. Your changes are not saved yet and are still in the form.
      </p>
      <div className="mt-3 flex flex-wrap gap-2">
        <Button variant="secondary" aria-expanded={showDiff} onClick={() => setShowDiff((v) => !v)}>
          {showDiff ? "Hide their changes" : "View their changes"}
        </Button>
        <Button variant="danger" disabled={pending} onClick={onOverwrite}>
          Overwrite with mine
        </Button>
        <Button variant="secondary" disabled={pending} onClick={onDiscard}>
          Discard mine
        </Button>
      </div>
      {showDiff ? (
        <div className="mt-4">
          <DiffTable
            rows={diffSnapshots(current, formSnapshot(mine))}
            beforeLabel={`Saved version ${current.version}`}
            afterLabel="Your form"
            caption={`Differences between saved version ${current.version} and your unsaved form`}
          />
        </div>
      ) : null}
    </section>
  );
}
