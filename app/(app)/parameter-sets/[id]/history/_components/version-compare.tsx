"use client";

import { useState } from "react";
import { DiffTable } from "@/components/parameter-sets/diff-table";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { diffSnapshots } from "@/lib/model/diff";
import type { ParameterSetVersion } from "@/lib/contracts/parameter-sets";

function VersionSelect({
  id,
  label,
  value,
  versions,
  onChange,
}: {
  id: string;
  label: string;
  value: number;
  versions: ParameterSetVersion[];
  onChange: (v: number) => void;
}) {
  return (
    <div className="w-44">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <select id={id} value={value} onChange={(event) => onChange(Number(event.target.value))} className={`mt-1 ${INPUT_CLASS}`}>
        {versions.map((v) => (
          <option key={v.version} value={v.version}>
            Version {v.version}
          </option>
        ))}
      </select>
    </div>
  );
}

/** Any two versions side by side; defaults to the newest and the one before it. */
export function VersionCompare({ versions }: { versions: ParameterSetVersion[] }) {
  const newest = versions[0]?.version ?? 1;
  const [picked, setPicked] = useState<{ from: number; to: number } | null>(null);
  // Until the user picks, follow the newest pair, so a restore shows its effect straight away.
  const from = picked?.from ?? versions[1]?.version ?? newest;
  const to = picked?.to ?? newest;
  const before = versions.find((v) => v.version === from);
  const after = versions.find((v) => v.version === to);

  return (
    <section aria-labelledby="compare-title">
      <h2 id="compare-title" className="mb-3 text-lg font-semibold">
        Compare versions
      </h2>
      {versions.length < 2 ? (
        <p className="text-sm text-ink-soft">There is only one version so far. Each save adds one, and you can compare any two here.</p>
      ) : (
        <>
          <div className="mb-4 flex flex-wrap items-end gap-4">
            <VersionSelect
              id="compare-from"
              label="Compare version"
              value={from}
              versions={versions}
              onChange={(v) => setPicked({ from: v, to })}
            />
            <VersionSelect
              id="compare-to"
              label="with version"
              value={to}
              versions={versions}
              onChange={(v) => setPicked({ from, to: v })}
            />
          </div>
          {before && after ? (
            <DiffTable
              rows={diffSnapshots(before, after)}
              beforeLabel={`Version ${from}`}
              afterLabel={`Version ${to}`}
              caption={`Differences between version ${from} and version ${to}`}
            />
          ) : null}
        </>
      )}
    </section>
  );
}
