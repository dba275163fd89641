"use client";

import { useState, type RefObject } from "react";
import { Button } from "@/components/ui/button";
import { downloadBlob, downloadText, serializeSvg, svgToPngBlob } from "./export-image";

/** "Export SVG" / "Export PNG" for one plot; the plot's title names it for screen readers. */
export function PlotExportButtons({ svgRef, fileBase, plotName }: { svgRef: RefObject<SVGSVGElement | null>; fileBase: string; plotName: string }) {
  const [error, setError] = useState<string | null>(null);
  const svg = () => svgRef.current;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Button
        variant="secondary"
        className="px-2.5 py-1 text-xs"
        aria-description={plotName}
        onClick={() => {
          const el = svg();
          if (el) downloadText(serializeSvg(el), `${fileBase}.svg`, "image/svg+xml");
        }}
      >
        Export SVG
      </Button>
      <Button
        variant="secondary"
        className="px-2.5 py-1 text-xs"
        aria-description={plotName}
        onClick={() => {
          const el = svg();
          if (!el) return;
          setError(null);
          svgToPngBlob(el).then(
            (blob) => downloadBlob(blob, `${fileBase}.png`),
            (e: unknown) => setError(e instanceof Error ? e.message : "PNG export failed."),
          );
        }}
      >
        Export PNG
      </Button>
      {error ? <span className="text-xs text-ember">{error}</span> : null}
    </div>
  );
}
