/*
 * The usual cautions where the planner and the rotator speak of lasers, strong fields and
 * cryostats. They remind; they do not assess risk. Every list ends by deferring to local rules and
 * the institution's laser safety officer.
 */

export interface Caution {
  key: "laser" | "magnet" | "cryogen" | "local";
  title: string;
  lines: string[];
}

const VISIBLE_NM = [400, 700] as const;

/**
 * An indicative hazard class for a continuous-wave line from its power alone, using the
 * accessible emission limits of IEC 60825-1 for long exposures as commonly quoted (Class 1
 * ≈ 0.39 mW and Class 2 < 1 mW in the visible, Class 3R < 5 mW in the visible, Class 3B ≤ 0.5 W;
 * from memory). The laser's label and the laser safety officer decide; beam size, pulsing and
 * wavelength move these limits.
 */
export function indicativeLaserClass(wavelengthNm: number, powerW: number | null): string {
  if (powerW === null) return "unknown (no power given)";
  const visible = wavelengthNm >= VISIBLE_NM[0] && wavelengthNm <= VISIBLE_NM[1];
  if (powerW > 0.5) return "4";
  if (powerW > 0.005) return "3B";
  if (!visible) return "1 to 3R, depending on wavelength — see the label";
  if (powerW <= 0.00039) return "1";
  if (powerW < 0.001) return "2";
  return "3R";
}

export interface CautionContext {
  lines: { name: string; wavelengthNm: number; powerW: number | null }[];
  /** Lowest temperature in the plan or rotator, K. */
  minTemperatureK: number | null;
  /** Largest |B0| in the plan or rotator, T. */
  maxFieldT: number | null;
}

export function cautionsFor(ctx: CautionContext): Caution[] {
  const out: Caution[] = [];
  const laser: string[] = ctx.lines.map(
    (l) =>
      `${l.name} (${l.wavelengthNm} nm${l.powerW !== null ? `, ${formatPower(l.powerW)}` : ""}): ` +
      `indicative class ${indicativeLaserClass(l.wavelengthNm, l.powerW)}.`,
  );
  laser.push(
    "Classify each laser by IEC 60825-1 (and ANSI Z136.1 in the US); Class 3B and 4 beams need a controlled area, " +
      "beam enclosures or stops, and eyewear of the optical density the laser safety officer specifies for that wavelength and power.",
    "Near-infrared lines (800–1550 nm) are invisible: check beam paths with a viewer card, never by eye; " +
      "remove watches and rings, and keep the beam below eye level.",
  );
  out.push({ key: "laser", title: "Lasers", lines: laser });
  if (ctx.maxFieldT !== null && ctx.maxFieldT > 0) {
    out.push({
      key: "magnet",
      title: "Strong magnetic fields",
      lines: [
        `Fields up to ${ctx.maxFieldT} T: a static field above 0.5 mT (5 gauss) can disturb pacemakers and other active implants. ` +
          "Mark the 0.5 mT line around the magnet and keep people with implants outside it.",
        "Ferromagnetic objects (tools, gas cylinders, chairs) become projectiles near a strong magnet: " +
          "keep them out of the marked area; watch for quench hazards with superconducting magnets.",
      ],
    });
  }
  if (ctx.minTemperatureK !== null && ctx.minTemperatureK < 250) {
    out.push({
      key: "cryogen",
      title: "Cryogens and cryostats",
      lines: [
        `Temperatures down to ${ctx.minTemperatureK} K mean liquid nitrogen or helium: ` +
          "they boil off into hundreds of times their volume of gas and can displace oxygen in a closed room " +
          "(asphyxiation, with no warning smell). Ventilate; use an oxygen monitor where the rules ask for one.",
        "Cryogens and cold surfaces cause cold burns: face shield, loose cryogenic gloves, closed shoes; " +
          "never seal a cryogen in a closed vessel.",
      ],
    });
  }
  out.push({
    key: "local",
    title: "Your local rules come first",
    lines: [
      "These are reminders, not a risk assessment. Follow your institution's rules, " +
        "and ask its laser safety officer (and whoever looks after magnets and cryogens) before the work starts.",
    ],
  });
  return out;
}

function formatPower(w: number): string {
  if (w >= 1) return `${w} W`;
  return `${Number((w * 1000).toPrecision(3))} mW`;
}
