"use client";

import { memo, useMemo, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { fmt, fmtLength, fmtPercent } from "@/lib/workbench/format";
import { markerColumns, type MarkerCellKind } from "@/lib/workbench/marker-columns";
import { checkMarkerText, MARKER_MAX_NM, MARKER_MIN_NM } from "@/lib/workbench/markers";
import type { Geometry, XUnit, YMode } from "@/lib/workbench/units";
import { DEFAULT_MARKERS_NM, MAX_MARKERS } from "@/lib/workbench/view-state";
import type { MarkerRow } from "./use-marker-values";

const FORMAT: Record<MarkerCellKind, (v: number | null) => string> = {
  number: (v) => fmt(v),
  percent: (v) => fmtPercent(v, 2),
  length: (v) => fmtLength(v),
};

function MarkerTableImpl({
  rows,
  computing,
  geometry,
  xUnit,
  yMode,
  methodLabel,
  banner,
  onAdd,
  onRemove,
  onReset,
}: {
  rows: readonly MarkerRow[];
  computing: boolean;
  geometry: Geometry;
  xUnit: XUnit;
  yMode: YMode;
  methodLabel: string;
  banner: string | null;
  onAdd: (nm: number) => void;
  onRemove: (nm: number) => void;
  onReset: () => void;
}) {
  const [draft, setDraft] = useState("");
  const [error, setError] = useState<string | null>(null);
  const withDiamagnetic = rows.some((r) => r.point?.thetaDiamagneticRad !== undefined);
  const columns = useMemo(() => markerColumns(xUnit, yMode, withDiamagnetic), [xUnit, yMode, withDiamagnetic]);
  const markersNm = rows.map((r) => r.nm);
  const anyInterpolated = rows.some((r) => r.source === "interpolated");

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const checked = checkMarkerText(draft, markersNm, MAX_MARKERS);
    if (checked.error !== null) {
      setError(checked.error);
      return;
    }
    setError(null);
    setDraft("");
    onAdd(checked.nm);
  };

  return (
    <section aria-label="Markers" className="space-y-3">
      <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
        <table className="w-full text-sm tabular-nums">
          <caption className="px-3 pt-3 pb-1 text-left font-semibold">
            Values at markers
            <span className="ml-2 text-xs font-normal text-ink-soft">
              ({methodLabel};{" "}
              {yMode === "verdet" ? "per tesla and metre" : `rotations at B0 = ${geometry.fieldT} T and L = ${fmtLength(geometry.lengthM)}`}
              )
            </span>
            {banner ? <span className="mt-0.5 block text-xs font-semibold text-ember">{banner}</span> : null}
          </caption>
          <thead className="text-left text-xs text-ink-soft">
            <tr className="border-b border-ink/10">
              <th scope="col" className="px-2.5 py-2 font-medium">
                Wavelength
              </th>
              {columns.map((c) => (
                <th key={c.id} scope="col" className="px-2.5 py-2 font-medium">
                  {c.header}
                </th>
              ))}
              <th scope="col" className="px-2.5 py-2 font-medium">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length + 2} className="px-3 py-3 text-ink-soft">
                  No markers. Add a laser line below or click a plot.
                </td>
              </tr>
            ) : null}
            {rows.map(({ nm, point, source }) => (
              <tr key={nm} className="border-b border-ink/5 last:border-0" data-source={source}>
                <th scope="row" className="px-3 py-1.5 text-left font-medium">{`${nm} nm`}</th>
                {columns.map((c) => (
                  <td
                    key={c.id}
                    // Interpolated stand-ins are set in italics and described, so the number itself stays clean.
                    className={`px-2.5 py-1.5${source === "interpolated" ? " text-ink-soft italic" : ""}`}
                    title={source === "interpolated" ? "Interpolated between grid points" : undefined}
                    aria-description={source === "interpolated" ? "interpolated between grid points" : undefined}
                  >
                    {point ? FORMAT[c.kind](c.value(point, geometry)) : "–"}
                  </td>
                ))}
                <td className="px-3 py-1.5 text-right">
                  <Button variant="quiet" className="text-xs" aria-label={`Remove marker at ${nm} nm`} onClick={() => onRemove(nm)}>
                    Remove
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {anyInterpolated || computing ? (
          <p role="status" className="px-3 pb-2 text-xs text-ink-soft">
            Values in italics are interpolated between grid points
            {computing ? " while the exact value is computed…" : "; the exact value could not be computed for this result."}
          </p>
        ) : null}
      </div>
      <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-2">
        <div>
          <label htmlFor="marker-add" className="block text-sm font-medium">
            Marker wavelength (nm)
          </label>
          <input
            id="marker-add"
            type="text"
            inputMode="decimal"
            autoComplete="off"
            placeholder="e.g. 1030"
            className="mt-1 w-36 rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm focus:border-lux"
            value={draft}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? "marker-add-hint marker-add-error" : "marker-add-hint"}
            onChange={(e) => {
              setDraft(e.target.value);
              if (error) setError(null);
            }}
          />
        </div>
        <Button type="submit" variant="secondary">
          Add marker
        </Button>
        <Button variant="quiet" onClick={onReset} disabled={markersNm.join() === DEFAULT_MARKERS_NM.join()}>
          Reset to 632.8, 800, 1064, 1550 nm
        </Button>
        <p id="marker-add-hint" className="w-full text-xs text-ink-soft">
          {MARKER_MIN_NM}–{MARKER_MAX_NM} nm, at most {MAX_MARKERS} markers. Adding one reads its values from the spectrum on screen;
          nothing is recomputed.
        </p>
        {error ? (
          <p id="marker-add-error" role="alert" className="w-full text-xs text-ember">
            {error}
          </p>
        ) : null}
      </form>
      <SafetyNote />
    </section>
  );
}

/** Short and factual: the L45 figures invite building a rotator, which means magnets, lasers and maybe cryogens. */
export function SafetyNote() {
  return (
    <aside
      aria-label="Safety note"
      className="rounded-md border border-ink/10 bg-paper-sunk px-3 py-2 text-xs leading-relaxed text-ink-soft"
    >
      <strong className="font-semibold text-ink">Safety, before building a rotator from these numbers:</strong>
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        <li>
          Laser: check the laser&apos;s safety class, and wear eyewear rated for its wavelength and power whenever the beam path is open.
        </li>
        <li>
          Magnet: strong fields attract ferromagnetic tools and objects and can disturb pacemakers and other implants. Mark the stray-field
          zone and keep people with implants out of it.
        </li>
        <li>
          Cryogens, for low-temperature runs: they cause cold burns and can displace oxygen. Wear a face shield and cryogenic gloves and
          work in a ventilated room.
        </li>
        <li>Your local rules and your laser safety officer take precedence over this note.</li>
      </ul>
    </aside>
  );
}

export const MarkerTable = memo(MarkerTableImpl);
