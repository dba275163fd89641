"use client";

import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { DateTime } from "@/components/ui/date-time";
import { diffSnapshots, type DiffFieldKey, type SetSnapshot } from "@/lib/model/diff";
import { PARAM_META } from "@/lib/model/param-meta";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";
import { DiffTable } from "./diff-table";
import { formSnapshot, type SetFormInput } from "./form-schema";

export interface MergePreview {
  merged: SetSnapshot;
  /** Fields taken from this user's form. */
  mine: DiffFieldKey[];
  /** Fields both people changed, to different values. */
  clashes: DiffFieldKey[];
}

interface ConflictBannerProps {
  current: ParameterSet;
  mine: SetFormInput;
  pending: boolean;
  /** Null until the user asks to merge; then the merged result to confirm. */
  preview: MergePreview | null;
  /** Why the merged values cannot be saved (e.g. a combination the model refuses). */
  previewError: string | null;
  onPreviewMerge: () => void;
  onCancelMerge: () => void;
  onSaveMerged: () => void;
  onDiscard: () => void;
}

const LABEL: Record<string, string> = {
  name: "Name",
  description: "Description",
  tags: "Tags",
  ...Object.fromEntries(PARAM_META.map((m) => [m.key, m.label])),
};

function fieldList(keys: DiffFieldKey[]): string {
  return keys.map((k) => LABEL[k] ?? k).join(", ");
}

/**
 * Someone else saved first: the user's form stays as it is until they choose what to do. The banner
 * is scrolled into view and takes the focus when it appears, since the Save button that caused it
 * sits at the bottom of a long form.
 */
export function ConflictBanner({
  current,
  mine,
  pending,
  preview,
  previewError,
  onPreviewMerge,
  onCancelMerge,
  onSaveMerged,
  onDiscard,
}: ConflictBannerProps) {
  const [showDiff, setShowDiff] = useState(false);
  const ref = useRef<HTMLElement>(null);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    el.scrollIntoView({ block: "start" });
    el.focus({ preventScroll: true });
  }, [current.version]);

  return (
    <section
      ref={ref}
      tabIndex={-1}
      role="alert"
      aria-labelledby="conflict-title"
      className={
        "scroll-mt-4 rounded-lg border border-ember bg-ember-light px-5 py-4 outline-none focus-visible:ring-2 focus-visible:ring-lux"
      }
    >
      <h2 id="conflict-title" className="font-semibold">
        Someone saved version {current.version} while you were editing
      </h2>
      <p className="mt-1 text-sm">
        {current.updatedBy.name} saved it on <DateTime iso={current.updatedAt} />. Your changes are not saved yet and are still in the form.
      </p>
      {preview ? (
        <div className="mt-4 space-y-3">
          <h3 className="font-semibold">Your changes applied to version {current.version}</h3>
          <p className="text-sm">
            {preview.mine.length === 0
              ? `You changed nothing that differs from version ${current.version}; saving would keep it as it is.`
              : `From your form: ${fieldList(preview.mine)}. Everything else stays as in version ${current.version}.`}
          </p>
          {preview.clashes.length > 0 ? (
            <p className="text-sm font-medium">Both of you changed {fieldList(preview.clashes)}; your value replaces theirs there.</p>
          ) : null}
          <DiffTable
            rows={diffSnapshots(current, preview.merged)}
            beforeLabel={`Saved version ${current.version}`}
            afterLabel="After saving"
            caption={`What saving the merge changes in version ${current.version}`}
          />
          {previewError ? <p className="text-sm font-medium">{previewError}</p> : null}
          <div className="flex flex-wrap gap-2">
            <Button disabled={pending || previewError !== null || preview.mine.length === 0} onClick={onSaveMerged}>
              {pending ? "Saving…" : "Save merged version"}
            </Button>
            <Button variant="secondary" disabled={pending} onClick={onCancelMerge}>
              Back
            </Button>
          </div>
        </div>
      ) : (
        <>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button variant="secondary" aria-expanded={showDiff} onClick={() => setShowDiff((v) => !v)}>
              {showDiff ? "Hide differences" : "Compare with my form"}
            </Button>
            <Button disabled={pending} onClick={onPreviewMerge}>
              Apply my changes to version {current.version}…
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
        </>
      )}
    </section>
  );
}
