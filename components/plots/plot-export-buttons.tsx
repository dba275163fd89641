"use client";

import { useState, type RefObject } from "react";
import { Button } from "@/components/ui/button";
import { downloadBlob, downloadText, serializeSvg, svgToPngBlob } from "./export-image";

/** "Export SVG" / "Export PNG" for one plot; the plot's title names it for screen readers. */
export function PlotExportButtons({
  svgRef,
  fileBase,
  plotName,
}: {
  svgRef: RefObject<SVGSVGElement | null>;
  fileBase: string;
  plotName: string;
}) {
  const [error, setError] = useState<string | null>(null);
  const formats: { label: string; save: (svg: SVGSVGElement) => void }[] = [
    { label: "Export SVG", save: (svg) => downloadText(serializeSvg(svg), `${fileBase}.svg`, "image/svg+xml") },
    {
      label: "Export PNG",
      save: (svg) => {
        setError(null);
        svgToPngBlob(svg).then(
          (blob) => downloadBlob(blob, `${fileBase}.png`),
          (e: unknown) => setError(e instanceof Error ? e.message : "PNG export failed."),
        );
      },
    },
  ];
  return (
    <div className="flex flex-wrap items-center gap-2">
      {formats.map(({ label, save }) => (
        <Button
          key={label}
          variant="secondary"
          className="px-2.5 py-1 text-xs"
          aria-description={plotName}
          onClick={() => {
            const svg = svgRef.current;
            if (svg) save(svg);
          }}
        >
          {label}
        </Button>
      ))}
      {error ? <span className="text-xs text-ember">{error}</span> : null}
    </div>
  );
}
