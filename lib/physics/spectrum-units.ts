import { VACUUM_IMPEDANCE_OHM } from "./constants";

/* Conversions between the engine's quantities and the reported ones (physics-model.md §1, §4.5, §6.3, §7). */

/**
 * Field amplitude h0 (A/m) of a circularly polarized beam of intensity I (W/m²) inside a medium of
 * index n (§4.5): E0 = √(I/(c ε0 n)), h0 = n E0/Z0 = √(n I/Z0).
 */
export function driveFieldAPerM(index: number, intensityWPerM2: number): number {
  return Math.sqrt((index * intensityWPerM2) / VACUUM_IMPEDANCE_OHM);
}

/** The drive in the LLG's scaled units (§7): h = γ μ0 h0/ω, with gammaMu0 = γ μ0 and ω in rad/s. */
export function scaledDrive(gammaMu0: number, h0APerM: number, omega: number): number {
  return (gammaMu0 * h0APerM) / omega;
}

/** V = θ/(B0 L) in rad/(T·m) (§1); null at zero field, where it is undefined. */
export function verdetRadPerTm(thetaRad: number, fieldT: number, lengthM: number): number | null {
  return fieldT === 0 ? null : thetaRad / (fieldT * lengthM);
}

/** |θm|/(|θe|+|θm|) (§6.3); null when both parts are 0. */
export function magneticShare(thetaElectricRad: number, thetaMagneticRad: number): number | null {
  const denom = Math.abs(thetaElectricRad) + Math.abs(thetaMagneticRad);
  return denom === 0 ? null : Math.abs(thetaMagneticRad) / denom;
}
