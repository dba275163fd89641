/*
 * Unit conversions for the workbench axes. The physics always speaks vacuum wavelength in nm and
 * rotation in rad; these helpers only change what the plots and tables show.
 */

/**
 * h·c/e in eV·nm. h, c and e are exact in the 2019 SI, so CODATA 2018 gives
 * hc = 1.239 841 984… × 10⁻⁶ eV·m (https://physics.nist.gov/cgi-bin/cuu/Value?hcev).
 */
export const HC_EV_NM = 1239.84198;
/** Speed of light in vacuum, m/s (exact, CODATA 2018). */
export const C_M_PER_S = 299_792_458;

export const X_UNITS = ["nm", "um", "eV", "cm-1", "THz"] as const;
export type XUnit = (typeof X_UNITS)[number];

export const X_UNIT_LABEL: Record<XUnit, string> = {
  nm: "nm",
  um: "µm",
  eV: "eV",
  "cm-1": "cm⁻¹",
  THz: "THz",
};

export const X_AXIS_TITLE: Record<XUnit, string> = {
  nm: "Wavelength (nm)",
  um: "Wavelength (µm)",
  eV: "Photon energy (eV)",
  "cm-1": "Wavenumber (cm⁻¹)",
  THz: "Frequency (THz)",
};

/** Vacuum wavelength in nm → value on the chosen x axis. */
export function fromNm(wavelengthNm: number, unit: XUnit): number {
  switch (unit) {
    case "nm":
      return wavelengthNm;
    case "um":
      return wavelengthNm / 1000;
    case "eV":
      return HC_EV_NM / wavelengthNm;
    case "cm-1":
      // 1 cm = 1e7 nm.
      return 1e7 / wavelengthNm;
    case "THz":
      // f = c / λ; c in nm/s is C·1e9, and 1 THz = 1e12 Hz.
      return (C_M_PER_S * 1e9) / wavelengthNm / 1e12;
  }
}

/** Value on the chosen x axis → vacuum wavelength in nm (the inverse of fromNm). */
export function toNm(value: number, unit: XUnit): number {
  switch (unit) {
    case "nm":
      return value;
    case "um":
      return value * 1000;
    case "eV":
      return HC_EV_NM / value;
    case "cm-1":
      return 1e7 / value;
    case "THz":
      return (C_M_PER_S * 1e9) / (value * 1e12);
  }
}

export const Y_MODES = ["rad", "mrad", "deg", "verdet"] as const;
export type YMode = (typeof Y_MODES)[number];

export const Y_MODE_LABEL: Record<YMode, string> = {
  rad: "Rotation (rad)",
  mrad: "Rotation (mrad)",
  deg: "Rotation (°)",
  verdet: "Verdet constant (rad/(T·m))",
};

export const Y_UNIT_SHORT: Record<YMode, string> = {
  rad: "rad",
  mrad: "mrad",
  deg: "°",
  verdet: "rad/(T·m)",
};

export interface Geometry {
  fieldT: number;
  lengthM: number;
}

/**
 * A rotation in rad (for the set's own field and length) → the chosen y quantity.
 * The Verdet form is θ / (B0 L) (physics-model §1); it is undefined at B0 = 0, hence null.
 */
export function rotationTo(thetaRad: number, mode: YMode, geometry: Geometry): number | null {
  switch (mode) {
    case "rad":
      return thetaRad;
    case "mrad":
      return thetaRad * 1e3;
    case "deg":
      return (thetaRad * 180) / Math.PI;
    case "verdet": {
      const bl = geometry.fieldT * geometry.lengthM;
      return bl === 0 ? null : thetaRad / bl;
    }
  }
}

/** Log-spaced (or linear) wavelength grid, strictly increasing, both ends included. */
export function wavelengthGrid(fromNm: number, toNm: number, points: number, spacing: "log" | "linear" = "log"): number[] {
  const n = Math.max(1, Math.floor(points));
  if (n === 1) return [fromNm];
  const out = new Array<number>(n);
  if (spacing === "log") {
    const a = Math.log(fromNm);
    const b = Math.log(toNm);
    for (let i = 0; i < n; i++) out[i] = Math.exp(a + ((b - a) * i) / (n - 1));
  } else {
    for (let i = 0; i < n; i++) out[i] = fromNm + ((toNm - fromNm) * i) / (n - 1);
  }
  // Pin the ends exactly so the table and CSV show the numbers the user typed.
  out[0] = fromNm;
  out[n - 1] = toNm;
  return out;
}

/**
 * The name of a curve as the y axis shows it. In Verdet mode every curve is divided by B·L, so
 * the parts are Ve and Vm, not angles θ; the ellipticity divided by B·L is no angle at all but an
 * ellipticity per unit field and length (rad/(T·m)).
 */
export type CurveKey = "total" | "electric" | "magnetic" | "cross" | "diamagnetic" | "ellipticity";

export function curveLabel(key: CurveKey, yMode: YMode): string {
  if (yMode === "verdet") {
    return {
      total: "Verdet constant V",
      electric: "Electric-dipole part Ve",
      magnetic: "Magnetic-dipole part Vm",
      cross: "Cross term Vx",
      diamagnetic: "Diamagnetic part Vdia (in Ve)",
      ellipticity: "Ellipticity per B·L",
    }[key];
  }
  return {
    total: "Total θ",
    electric: "Electric-dipole θe",
    magnetic: "Magnetic-dipole θm",
    cross: "Cross term θx",
    diamagnetic: "Diamagnetic θdia (in θe)",
    ellipticity: "Ellipticity angle atan(tanh η)",
  }[key];
}

/** The short symbol of a curve in the hover readout: θ, θe … or V, Ve … in Verdet mode. */
export function curveSymbol(key: CurveKey, yMode: YMode): string {
  const verdet = yMode === "verdet";
  return {
    total: verdet ? "V" : "θ",
    electric: verdet ? "Ve" : "θe",
    magnetic: verdet ? "Vm" : "θm",
    cross: verdet ? "Vx" : "θx",
    diamagnetic: verdet ? "Vdia (in Ve)" : "θdia (in θe)",
    ellipticity: verdet ? "Ellipticity per B·L" : "Ellipticity angle",
  }[key];
}
