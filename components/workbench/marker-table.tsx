"use client";

import { memo, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import type { SpectrumResult } from "@/lib/physics/types";
import { markerValues } from "@/lib/workbench/derived";
import { fmt, fmtLength, fmtPercent } from "@/lib/workbench/format";
import { parseNumber } from "@/lib/workbench/validate";
import { DEFAULT_MARKERS_NM, MAX_MARKERS } from "@/lib/workbench/view-state";

function MarkerTableImpl({
  markersNm,
  result,
  fieldT,
  methodLabel,
  banner,
  onAdd,
  onRemove,
  onReset,
}: {
  markersNm: readonly number[];
  result: SpectrumResult | null;
  fieldT: number;
  methodLabel: string;
  banner: string | null;
  onAdd: (nm: number) => void;
  onRemove: (nm: number) => void;
  onReset: () => void;
}) {
  const [draft, setDraft] = useState("");
  const [error, setError] = useState<string | null>(null);
  const byNm = new Map((result?.points ?? []).map((p) => [p.wavelengthNm, p]));
  const sorted = [...markersNm].sort((a, b) => a - b);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const v = parseNumber(draft);
    if (v === null || v <= 0 || v > 1e7) {
      setError("Enter a wavelength in nm, e.g. 1064.");
      return;
    }
    if (markersNm.length >= MAX_MARKERS) {
      setError(`At most ${MAX_MARKERS} markers.`);
      return;
    }
    setError(null);
    setDraft("");
    onAdd(v);
  };

  return (
    <section aria-label="Markers" className="space-y-3">
      <div className="overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
        <table className="w-full text-sm tabular-nums">
          <caption className="px-3 pt-3 pb-1 text-left font-semibold">
            Values at markers
            <span className="ml-2 text-xs font-normal text-ink-soft">({methodLabel}; rotations at B0 = {fieldT} T and the set&apos;s length)</span>
            {banner ? <span className="mt-0.5 block text-xs font-semibold text-ember">{banner}</span> : null}
          </caption>
          <thead className="text-left text-xs text-ink-soft">
            <tr className="border-b border-ink/10">
              <th scope="col" className="px-2.5 py-2 font-medium">Wavelength</th>
              <th scope="col" className="px-2.5 py-2 font-medium">θ (rad)</th>
              <th scope="col" className="px-2.5 py-2 font-medium">θe (rad)</th>
              <th scope="col" className="px-2.5 py-2 font-medium">θm (rad)</th>
              <th scope="col" className="px-2.5 py-2 font-medium">Magnetic share</th>
              <th scope="col" className="px-2.5 py-2 font-medium">V (rad/(T·m))</th>
              <th scope="col" className="px-2.5 py-2 font-medium">L45</th>
              <th scope="col" className="px-2.5 py-2 font-medium">θm / θ</th>
              <th scope="col" className="px-2.5 py-2 font-medium"><span className="sr-only">Remove</span></th>
            </tr>
          </thead>
          <tbody>
            {sorted.length === 0 ? (
              <tr>
                <td colSpan={9} className="px-3 py-3 text-ink-soft">
                  No markers. Add a laser line below or click a plot.
                </td>
              </tr>
            ) : null}
            {sorted.map((nm) => {
              const p = byNm.get(nm);
              const v = p ? markerValues(p, fieldT) : null;
              return (
                <tr key={nm} className="border-b border-ink/5 last:border-0">
                  <th scope="row" className="px-3 py-1.5 text-left font-medium">{`${nm} nm`}</th>
                  <td className="px-2.5 py-1.5">{fmt(v?.thetaRad)}</td>
                  <td className="px-2.5 py-1.5">{fmt(v?.thetaElectricRad)}</td>
                  <td className="px-2.5 py-1.5">{fmt(v?.thetaMagneticRad)}</td>
                  <td className="px-2.5 py-1.5">{fmtPercent(v?.magneticShare, 2)}</td>
                  <td className="px-2.5 py-1.5">{fmt(v?.verdetRadPerTm)}</td>
                  <td className="px-2.5 py-1.5">{fmtLength(v?.length45M)}</td>
                  <td className="px-2.5 py-1.5">{fmt(v?.signedRatio)}</td>
                  <td className="px-3 py-1.5 text-right">
                    <Button variant="quiet" className="text-xs" aria-label={`Remove marker at ${nm} nm`} onClick={() => onRemove(nm)}>
                      Remove
                    </Button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
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
            aria-describedby={error ? "marker-add-error" : undefined}
            onChange={(e) => setDraft(e.target.value)}
          />
        </div>
        <Button type="submit" variant="secondary">
          Add marker
        </Button>
        <Button variant="quiet" onClick={onReset} disabled={sorted.join() === DEFAULT_MARKERS_NM.join()}>
          Reset to 632.8, 800, 1064, 1550 nm
        </Button>
        {error ? (
          <p id="marker-add-error" className="w-full text-xs text-ember">
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
    <aside aria-label="Safety note" className="rounded-md border border-ink/10 bg-paper-sunk px-3 py-2 text-xs leading-relaxed text-ink-soft">
      <strong className="font-semibold text-ink">Safety, before building a rotator from these numbers:</strong>
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        <li>
          Laser: check the laser&apos;s safety class, and wear eyewear rated for its wavelength and power whenever the beam path is open.
        </li>
        <li>
          Magnet: strong fields attract ferromagnetic tools and objects and can disturb pacemakers and other implants. Mark the
          stray-field zone and keep people with implants out of it.
        </li>
        <li>
          Cryogens, for low-temperature runs: they cause cold burns and can displace oxygen. Wear a face shield and cryogenic gloves
          and work in a ventilated room.
        </li>
        <li>Your local rules and your laser safety officer take precedence over this note.</li>
      </ul>
    </aside>
  );
}

export const MarkerTable = memo(MarkerTableImpl);
