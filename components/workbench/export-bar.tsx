"use client";

import { Button } from "@/components/ui/button";
import { downloadText } from "@/components/plots/export-image";
import type { ModelParams } from "@/lib/physics/schema";
import { buildSpectrumCsv, buildSpectrumJson, exportFileName, type ExportMeta } from "@/lib/workbench/export";
import type { ComputedSpectrum } from "./use-spectrum-run";

export function ExportBar({
  shown,
  params,
  setName,
  setId,
  version,
}: {
  shown: ComputedSpectrum | null;
  params: ModelParams | null;
  setName: string;
  setId: string | null;
  version: number | null;
}) {
  const ready = shown !== null && params !== null;
  const meta = (): ExportMeta => ({ setName, setId, version, method: shown!.method, exportedAt: new Date().toISOString() });
  return (
    <section aria-label="Export" className="flex flex-wrap items-center gap-2">
      <span className="text-sm font-medium">Data</span>
      <Button
        variant="secondary"
        disabled={!ready}
        onClick={() => downloadText(buildSpectrumCsv(meta(), params!, shown!.result), exportFileName(setName, "spectrum", "csv"), "text/csv")}
      >
        Export CSV
      </Button>
      <Button
        variant="secondary"
        disabled={!ready}
        onClick={() =>
          downloadText(buildSpectrumJson(meta(), params!, shown!.result), exportFileName(setName, "spectrum", "json"), "application/json")
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
