/*
 * The version of the compute engine (lib/physics through the run kinds) that lab-run workers carry.
 * The major number changes when the same payload would give a different result or a payload or
 * result column changes meaning; the minor when a kind or column is added; the patch for fixes that
 * change no figure. A run records the version it was made for, its result the version that computed
 * it, and a worker hands back any job made for another major version (a lab upgrading its machines
 * one by one never mixes two engines in one result).
 */

// 1.1.0: map results carry θe and the Verdet constant per cell beside the share, θ and θm.
export const ENGINE_VERSION = "1.1.0";

/** The major number of a version string such as "1.4.2"; NaN when it is not one. */
export function engineMajor(version: string): number {
  const match = /^(\d+)\.\d+\.\d+$/.exec(version);
  return match ? Number(match[1]) : Number.NaN;
}

/** A worker of engine `mine` may compute a job made for `wanted`. */
export function engineCompatible(wanted: string, mine: string = ENGINE_VERSION): boolean {
  return engineMajor(wanted) === engineMajor(mine) && !Number.isNaN(engineMajor(mine));
}
