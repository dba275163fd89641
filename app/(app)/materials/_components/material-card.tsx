import { MATERIAL_SOURCES } from "@/lib/materials/sources";
import type { MaterialEntry } from "@/lib/materials/library";
import { formatNumberInput } from "@/lib/model/number-text";
import { CopyMaterial } from "./copy-material";

/** One library material: what it is, its ranges and windows, every value with its source, the references. */
export function MaterialCard({ material: m }: { material: MaterialEntry }) {
  const v = m.validity;
  return (
    <article aria-labelledby={`material-${m.id}`} className="rounded-lg border border-ink/15 bg-paper p-4">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <h2 id={`material-${m.id}`} className="text-lg font-semibold">
            {m.name} <span className="font-normal text-ink-soft">· {m.formula}</span>
          </h2>
          <p className="text-sm text-ink-soft">{m.kind}</p>
          <p className="mt-2 max-w-3xl text-sm">{m.summary}</p>
        </div>
        <CopyMaterial materialId={m.id} materialName={m.name} />
      </header>
      <dl className="mt-3 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="font-medium">Wavelength</dt>
        <dd>
          {v.wavelengthNm.min}–{v.wavelengthNm.max} nm — {v.notes.wavelength}
        </dd>
        <dt className="font-medium">Temperature</dt>
        <dd>
          {v.temperatureK.min}–{v.temperatureK.max} K — {v.notes.temperature}
        </dd>
        <dt className="font-medium">Field</dt>
        <dd>
          |B0| ≤ {v.fieldT.max} T — {v.notes.field}
        </dd>
        {m.windows.map((w) => (
          <Band key={`w${w.fromNm}`} label="Window" band={w} />
        ))}
        {m.avoid.map((w) => (
          <Band key={`a${w.fromNm}`} label="Avoid" band={w} />
        ))}
      </dl>
      <details className="mt-3">
        <summary className="cursor-pointer text-sm font-medium">Values and their sources</summary>
        <div className="mt-2 overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-ink/10">
                <th scope="col" className="py-1 pr-4 font-medium">
                  Key
                </th>
                <th scope="col" className="py-1 pr-4 font-medium">
                  Value
                </th>
                <th scope="col" className="py-1 font-medium">
                  Source
                </th>
              </tr>
            </thead>
            <tbody>
              {Object.entries(m.params).map(([key, value]) => (
                <tr key={key} className="border-b border-ink/5 align-top">
                  <td className="py-1 pr-4 font-mono text-xs">{key}</td>
                  <td className="py-1 pr-4 tabular-nums">{showValue(value)}</td>
                  <td className="py-1">{m.valueSources[key]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
      <details className="mt-2">
        <summary className="cursor-pointer text-sm font-medium">References</summary>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
          {m.sources.map((id) => {
            const s = MATERIAL_SOURCES[id];
            return (
              <li key={id}>
                <span className="font-mono text-xs">[{id}]</span> {s.citation}
                {"seenIn" in s ? <span className="text-ink-soft"> (seen in: {s.seenIn})</span> : null}
              </li>
            );
          })}
        </ul>
      </details>
    </article>
  );
}

function Band({ label, band }: { label: string; band: MaterialEntry["windows"][number] }) {
  return (
    <>
      <dt className="font-medium">{label}</dt>
      <dd>
        {band.fromNm}–{band.toNm} nm — {band.note} ({band.sources.join(", ")})
      </dd>
    </>
  );
}

function showValue(value: unknown): string {
  if (typeof value === "number") return formatNumberInput(value);
  if (Array.isArray(value)) return `table of ${value.length} rows`;
  return String(value);
}
