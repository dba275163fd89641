"use client";

import { Button } from "@/components/ui/button";
import { downloadText } from "@/components/plots/export-image";
import { buildSpectrumCsv, buildSpectrumJson, exportFileName, type ExportMeta } from "@/lib/workbench/export";
import type { ComputedSpectrum } from "./use-spectrum-run";

export function ExportBar({
  shown,
  setName,
  setId,
  version,
}: {
  shown: ComputedSpectrum | null;
  setName: string;
  setId: string | null;
  version: number | null;
}) {
  // The export is of the result on screen, with the parameters it was computed from, so it stays
  // available (and correct) while newer inputs are invalid or their run failed.
  const ready = shown !== null;
  const meta = (): ExportMeta => ({ setName, setId, version, method: shown!.method, exportedAt: new Date().toISOString() });
  return (
    <section aria-label="Export" className="flex flex-wrap items-center gap-2">
      <span className="text-sm font-medium">Data</span>
      <Button
        variant="secondary"
        disabled={!ready}
        onClick={() => downloadText(buildSpectrumCsv(meta(), shown!.params, shown!.result), exportFileName(setName, "spectrum", "csv"), "text/csv")}
      >
        Export CSV
      </Button>
      <Button
        variant="secondary"
        disabled={!ready}
        onClick={() =>
          downloadText(buildSpectrumJson(meta(), shown!.params, shown!.result), exportFileName(setName, "spectrum", "json"), "application/json")
        }
      >
        Export JSON
      </Button>
      {shown ? (
        <span className="text-xs text-ink-soft">
          {shown.result.points.length} wavelengths, {shown.method === "llg" ? "numerical LLG" : "analytic preview"}
        </span>
      ) : null}
    </section>
  );
}
