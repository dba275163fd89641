/*
 * Refractive-index formulas as the sources print them (pure). The two Sellmeier forms are those of
 * the refractiveindex.info database (M. N. Polyanskiy, Sci. Data 11, 94 (2024)), λ in µm:
 *   "sellmeier"  (its formula 1): n² − 1 = C0 + Σ Bᵢ λ² / (λ² − Cᵢ²)   (Cᵢ in µm)
 *   "sellmeier2" (its formula 2): n² − 1 = C0 + Σ Bᵢ λ² / (λ² − Cᵢ)    (Cᵢ in µm²)
 * A "table" is a source's tabulated n(λ), interpolated linearly between its rows.
 */

export interface SellmeierTerm {
  b: number;
  c: number;
}

export type IndexFormula =
  | { kind: "sellmeier"; constant: number; terms: readonly SellmeierTerm[] }
  | { kind: "sellmeier2"; constant: number; terms: readonly SellmeierTerm[] }
  | { kind: "table"; rows: readonly { wavelengthNm: number; n: number }[] };

/** n(λ) of a formula at a vacuum wavelength in nm; NaN where a table does not reach. */
export function indexAt(formula: IndexFormula, wavelengthNm: number): number {
  if (formula.kind === "table") return interpolate(formula.rows, wavelengthNm);
  const l2 = (wavelengthNm / 1000) ** 2;
  let n2 = 1 + formula.constant;
  for (const t of formula.terms) n2 += (t.b * l2) / (l2 - (formula.kind === "sellmeier" ? t.c * t.c : t.c));
  return Math.sqrt(n2);
}

function interpolate(rows: readonly { wavelengthNm: number; n: number }[], nm: number): number {
  for (let i = 1; i < rows.length; i++) {
    const a = rows[i - 1]!;
    const b = rows[i]!;
    if (nm >= a.wavelengthNm && nm <= b.wavelengthNm)
      return a.n + ((nm - a.wavelengthNm) / (b.wavelengthNm - a.wavelengthNm)) * (b.n - a.n);
  }
  return Number.NaN;
}
