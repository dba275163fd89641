import { sizeRotator } from "@/lib/planner/rotator";
import type { ModelParams } from "@/lib/physics/schema";
import { fmt, fmtPercent } from "@/lib/workbench/format";

/*
 * Rotator sizing at the set's marker wavelengths, as the planner's rotator panel sizes it (45°,
 * a 30 dB isolation target, the set's temperature and field; analytic model): length, V and its
 * magnetic share, and the temperature and field windows that keep the isolation.
 */

const TARGET_DEG = 45;
const ISOLATION_DB = 30;

function windowText(w: { low: number; high: number; lowOpen: boolean; highOpen: boolean } | null, unit: string): string {
  if (!w) return "–";
  return `${w.lowOpen ? "≤ " : ""}${fmt(w.low, 4)} to ${w.highOpen ? "≥ " : ""}${fmt(w.high, 4)} ${unit}`;
}

export function ReportRotator({ params, wavelengthsNm }: { params: ModelParams; wavelengthsNm: number[] }) {
  const fieldT = params.fieldT || 1;
  const rows = wavelengthsNm.flatMap((wavelengthNm) => {
    try {
      const r = sizeRotator({
        params,
        wavelengthNm,
        temperatureK: params.temperatureK,
        fieldT,
        targetAngleDeg: TARGET_DEG,
        isolationTargetDb: ISOLATION_DB,
      });
      return [{ wavelengthNm, r }];
    } catch {
      return [];
    }
  });
  if (rows.length === 0) return <p className="text-sm text-ink-soft">No marker wavelength to size a rotator at.</p>;
  return (
    <>
      <p className="text-sm text-ink-soft">
        A {TARGET_DEG}° rotator at {params.temperatureK} K and {fmt(fieldT, 4)} T
        {params.fieldT === 0 ? " (the set's field is 0 T; 1 T is used)" : ""}, windows for an isolation of at least {ISOLATION_DB} dB (ideal
        polarizers), analytic model.
      </p>
      <div className="relative mt-2 overflow-x-auto">
        <table className="w-full text-sm tabular-nums">
          <caption className="sr-only">Rotator sizing at the marker wavelengths</caption>
          <thead className="text-left text-ink-soft">
            <tr>
              <th scope="col" className="py-1 font-medium">
                λ (nm)
              </th>
              <th scope="col" className="text-right font-medium">
                Length for {TARGET_DEG}° (mm)
              </th>
              <th scope="col" className="text-right font-medium">
                V (rad/(T·m))
              </th>
              <th scope="col" className="text-right font-medium">
                magnetic share
              </th>
              <th scope="col" className="pl-2 font-medium">
                temperature window
              </th>
              <th scope="col" className="pl-2 font-medium">
                field window
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ wavelengthNm, r }) => (
              <tr key={wavelengthNm} className="border-t border-ink/10">
                <td className="py-0.5">{wavelengthNm}</td>
                <td className="text-right">{r.lengthM !== null ? fmt(r.lengthM * 1000, 4) : "– (no rotation)"}</td>
                <td className="text-right">{fmt(r.verdetRadPerTm, 4)}</td>
                <td className="text-right">{fmtPercent(r.magneticShare)}</td>
                <td className="pl-2">{windowText(r.temperatureWindowK, "K")}</td>
                <td className="pl-2">{windowText(r.fieldWindowT, "T")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
