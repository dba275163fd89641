/*
 * Where the magnetic share (physics-model §6.3) crosses 50 %: linear interpolation between the
 * two grid points that bracket 0.5. Null shares (no spins / no field) break a bracket.
 */

export interface SharePoint {
  wavelengthNm: number;
  magneticShare: number | null;
}

/** Every wavelength (nm) at which the share passes 0.5, in grid order. Empty: no crossing in range. */
export function shareCrossingsNm(points: readonly SharePoint[], level = 0.5): number[] {
  const out: number[] = [];
  for (let i = 0; i < points.length; i++) {
    const a = points[i]!;
    if (a.magneticShare === null || !Number.isFinite(a.magneticShare)) continue;
    if (a.magneticShare === level) {
      // Count an exact hit once, not again as the start of the next bracket.
      if (out[out.length - 1] !== a.wavelengthNm) out.push(a.wavelengthNm);
      continue;
    }
    const b = points[i + 1];
    if (!b || b.magneticShare === null || !Number.isFinite(b.magneticShare)) continue;
    const da = a.magneticShare - level;
    const db = b.magneticShare - level;
    if (db === 0) {
      out.push(b.wavelengthNm);
      i++;
      continue;
    }
    if (da * db < 0) {
      const t = da / (da - db);
      out.push(a.wavelengthNm + t * (b.wavelengthNm - a.wavelengthNm));
    }
  }
  return out;
}

/** "crosses 50 % at 1234 nm" / "does not cross in range" — the one sentence the share panel shows. */
export function describeCrossing(crossingsNm: readonly number[]): string {
  if (crossingsNm.length === 0) return "does not cross 50 % in range";
  const list = crossingsNm.map((nm) => `${formatNm(nm)} nm`).join(", ");
  return `crosses 50 % at ${list}`;
}

function formatNm(nm: number): string {
  return nm >= 100 ? nm.toFixed(0) : nm.toPrecision(3);
}
