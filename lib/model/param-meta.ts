import type { ModelFlagKey, NumericModelParamKey } from "@/lib/physics/schema";

/*
 * What a scientist needs to fill in a model parameter: label, unit, one sentence of help and a
 * typical value. Shared by the parameter-set form and the workbench panel. Typical values are the
 * terbium-garnet figures of physics-model.md §9 unless stated otherwise.
 */

export interface ParamMeta {
  key: NumericModelParamKey;
  label: string;
  /** Unit as shown to the user (plain text). */
  unit: string;
  help: string;
  /** Step for number inputs ("any" allows every value). */
  step: string;
  group: "spins" | "optics" | "conditions";
}

export const PARAM_META: readonly ParamMeta[] = [
  {
    key: "ionDensityPerM3",
    label: "Ion density",
    unit: "m⁻³",
    step: "any",
    group: "spins",
    help: "Number of magnetic ions per cubic metre; about 1.27e28 for a terbium garnet (0 means no spins).",
  },
  {
    key: "landeG",
    label: "Landé g",
    unit: "",
    step: "any",
    group: "spins",
    help: "Landé factor of the ion's ground multiplet; sets γ = g μB / ħ. Tb³⁺ (⁷F₆): 1.5.",
  },
  {
    key: "totalJ",
    label: "Total J",
    unit: "",
    step: "0.5",
    group: "spins",
    help: "Total angular momentum quantum number of an ion, a multiple of 1/2. Tb³⁺: 6.",
  },
  {
    key: "curieWeissK",
    label: "Curie–Weiss θ",
    unit: "K",
    step: "any",
    group: "spins",
    help: "Mean-field interaction temperature; negative for antiferromagnetic coupling. Terbium garnet: about −8 K.",
  },
  {
    key: "gilbertDamping",
    label: "Gilbert damping α",
    unit: "",
    step: "any",
    group: "spins",
    help:
      "Dimensionless damping of the spin precession in the LLG equation; " +
      "0.01 is illustrative (no measured value for a terbium garnet).",
  },
  {
    key: "magneticScale",
    label: "Magnetic-part scale",
    unit: "×",
    step: "any",
    group: "spins",
    help: "Multiplies the magnetic-dipole part only, for fits and what-ifs; 1 is first-principles.",
  },
  {
    key: "epsInf",
    label: "Background ε∞",
    unit: "",
    step: "any",
    group: "optics",
    help: "Constant background permittivity; 1 when a Sellmeier pole carries the index.",
  },
  {
    key: "sellmeierB",
    label: "Sellmeier B",
    unit: "",
    step: "any",
    group: "optics",
    help: "Strength of the undamped background pole that carries most of the refractive index; 2.73 for a terbium garnet.",
  },
  {
    key: "sellmeierWavelengthNm",
    label: "Sellmeier pole λS",
    unit: "nm",
    step: "any",
    group: "optics",
    help: "Wavelength of the background index pole, in the ultraviolet; about 136 nm for a terbium garnet.",
  },
  {
    key: "oscillatorStrength",
    label: "Oscillator strength f",
    unit: "",
    step: "any",
    group: "optics",
    help: "Isotropic strength of the gyrotropic transition; keeps both circular modes passive; 0.015 is illustrative.",
  },
  {
    key: "oscillatorWavelengthNm",
    label: "Oscillator λE",
    unit: "nm",
    step: "any",
    group: "optics",
    help: "Wavelength of the effective gyrotropic transition that sets the Verdet dispersion; about 258 nm for a terbium garnet.",
  },
  {
    key: "oscillatorDampingRadPerS",
    label: "Oscillator damping ΓE",
    unit: "rad/s",
    step: "any",
    group: "optics",
    help: "Linewidth of the gyrotropic transition; 1e14 rad/s is illustrative.",
  },
  {
    key: "gyrationPerT",
    label: "Gyration κE",
    unit: "T⁻¹",
    step: "any",
    group: "optics",
    help: "Gyration per unit μ0·M0 of the transition; positive gives the negative Verdet constant of terbium materials (5.4e-3).",
  },
  {
    key: "temperatureK",
    label: "Temperature",
    unit: "K",
    step: "any",
    group: "conditions",
    help: "Sample temperature; must lie above the Curie–Weiss temperature. Room temperature is 293.15 K.",
  },
  {
    key: "fieldT",
    label: "Field B0",
    unit: "T",
    step: "any",
    group: "conditions",
    help: "Applied field μ0·H along the beam; negative points against the propagation. 1 T is a typical rotator magnet.",
  },
  {
    key: "lengthM",
    label: "Sample length",
    unit: "m",
    step: "any",
    group: "conditions",
    help: "Optical path through the sample along the field; a 10 mm crystal is 0.01 m.",
  },
];

/**
 * The model's on/off switches, shown as labelled checkboxes. Kept apart from PARAM_META (the
 * numeric parameters), so nothing that walks the numbers (number boxes, ranges, a fit's free
 * parameters) can pick a switch up.
 */
export interface FlagMeta {
  key: ModelFlagKey;
  label: string;
  help: string;
  group: ParamMeta["group"];
}

export const FLAG_META: readonly FlagMeta[] = [
  {
    key: "diamagneticTerm",
    label: "Diamagnetic (bound-electron) term",
    group: "optics",
    help:
      "Adds the classical bound-electron gyration of every pole of ε (the Becquerel form V = (e/2mₑc) λ |dn/dλ|). " +
      "It follows the field, not the spins, so with it the share moves with temperature and field " +
      "and a set without spins still rotates. Off by default.",
  },
];

export const PARAM_GROUP_LABEL: Record<ParamMeta["group"], string> = {
  spins: "Magnetic ions",
  optics: "Optical background and transition",
  conditions: "Conditions",
};
