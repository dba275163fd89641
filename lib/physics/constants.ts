/*
 * Physical constants, CODATA 2018 recommended values (E. Tiesinga, P. J. Mohr, D. B. Newell and
 * B. N. Taylor, "CODATA recommended values of the fundamental physical constants: 2018",
 * Rev. Mod. Phys. 93, 025010 (2021); NIST https://physics.nist.gov/cuu/Constants/).
 * h, e, k_B and c are exact in the 2019 SI; the others carry CODATA 2018 uncertainties.
 */

/** Bohr magneton μ_B, J/T. */
export const BOHR_MAGNETON_J_PER_T = 9.2740100783e-24;
/** Reduced Planck constant ħ, J s (exact, h / 2π). */
export const HBAR_J_S = 1.054571817e-34;
/** Planck constant h, J s (exact). */
export const PLANCK_J_S = 6.62607015e-34;
/** Boltzmann constant k_B, J/K (exact). */
export const BOLTZMANN_J_PER_K = 1.380649e-23;
/** Vacuum magnetic permeability μ0, N/A². */
export const MU0_N_PER_A2 = 1.25663706212e-6;
/** Vacuum electric permittivity ε0, F/m. */
export const EPS0_F_PER_M = 8.8541878128e-12;
/** Speed of light in vacuum c, m/s (exact). */
export const SPEED_OF_LIGHT_M_PER_S = 299792458;
/** Elementary charge e, C (exact). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** Electron mass m_e, kg. */
export const ELECTRON_MASS_KG = 9.1093837015e-31;
/** Magnitude of the electron g-factor |g_e|. */
export const ELECTRON_G_FACTOR = 2.00231930436256;
/** Characteristic impedance of vacuum Z0 = μ0 c, Ω. */
export const VACUUM_IMPEDANCE_OHM = MU0_N_PER_A2 * SPEED_OF_LIGHT_M_PER_S;

/** Gyromagnetic ratio γ = g μ_B / ħ in rad/(s T) for a Landé factor g (physics-model.md §4.1). */
export function gyromagneticRatio(landeG: number): number {
  return (landeG * BOHR_MAGNETON_J_PER_T) / HBAR_J_S;
}

/** Angular frequency ω = 2π c / λ in rad/s for a vacuum wavelength in nm. */
export function angularFrequencyFromNm(wavelengthNm: number): number {
  return (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (wavelengthNm * 1e-9);
}
