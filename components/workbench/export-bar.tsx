"use client";

import { Button } from "@/components/ui/button";
import { downloadText } from "@/components/plots/export-image";
import { buildSpectrumCsv, buildSpectrumJson, type ExportMeta } from "@/lib/workbench/export";
import type { XUnit, YMode } from "@/lib/workbench/units";
import type { ComputedSpectrum } from "./use-spectrum-run";
import { countOf, noun } from "@/lib/text/plural";

export function ExportBar({
  shown,
  setName,
  setId,
  version,
  fileBase,
  display,
}: {
  shown: ComputedSpectrum | null;
  setName: string;
  setId: string | null;
  version: number | null;
  /** Set, version, temperature and field (figureFileBase), so a folder of exports stays legible. */
  fileBase: string;
  /** The plot's units: the CSV adds columns in them after the SI ones. */
  display: { xUnit: XUnit; yMode: YMode };
}) {
  // The export is of the result on screen, with the parameters it was computed from, so it stays
  // available (and correct) while newer inputs are invalid or their run failed.
  const ready = shown !== null;
  const meta = (): ExportMeta => ({
    setName,
    setId,
    version,
    method: shown!.method,
    exportedAt: new Date().toISOString(),
    display: { xUnit: display.xUnit, yMode: display.yMode },
  });
  return (
    <section aria-label="Export" className="flex flex-wrap items-center gap-2">
      <span className="text-sm font-medium">Data</span>
      <Button
        variant="secondary"
        disabled={!ready}
        onClick={() => downloadText(buildSpectrumCsv(meta(), shown!.params, shown!.result), `${fileBase}-spectrum.csv`, "text/csv")}
      >
        Export CSV
      </Button>
      <Button
        variant="secondary"
        disabled={!ready}
        title="One header row and the data: reads with numpy.genfromtxt(names=True), pandas.read_csv or the csv module"
        onClick={() =>
          downloadText(buildSpectrumCsv(meta(), shown!.params, shown!.result, "plain"), `${fileBase}-spectrum-plain.csv`, "text/csv")
        }
      >
        CSV, plain header
      </Button>
      <Button
        variant="secondary"
        disabled={!ready}
        onClick={() =>
          downloadText(buildSpectrumJson(meta(), shown!.params, shown!.result), `${fileBase}-spectrum.json`, "application/json")
        }
      >
        Export JSON
      </Button>
      {shown ? (
        <span className="text-xs text-ink-soft">
          {countOf(shown.result.points.length, noun("wavelength"))}, {shown.method === "llg" ? "numerical LLG" : "analytic preview"}
        </span>
      ) : null}
    </section>
  );
}
