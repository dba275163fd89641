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

/*
 * Class 1 accessible emission limits of IEC 60825-1 for a continuous-wave beam viewed for a long
 * time (t > T2, the small-source case), in W, from memory (not checked against the standard's
 * tables; the laser's label and the laser safety officer decide):
 *   400–700 nm     3.9e-4 W
 *   700–1050 nm    3.9e-4 · C4 W, C4 = 10^(0.002 (λ − 700))
 *   1050–1400 nm   3.9e-4 · 5 · C7 W, C7 = 1 below 1150 nm, 10^(0.018 (λ − 1150)) to 1200 nm,
 *                  8 + 10^(0.04 (λ − 1250)) to 1400 nm
 *   1400–4000 nm   1.0e-2 W (the eye's media absorb the beam before the retina)
 * Class 2 (visible only) < 1 mW; Class 3R ≤ 5 × the Class 1 limit (5 × the Class 2 limit in the
 * visible, i.e. 5 mW); Class 3B ≤ 0.5 W. Outside 400–4000 nm no indication is given.
 */
const VISIBLE_CLASS1_W = 3.9e-4;
const CLASS2_W = 1e-3;
const CLASS3B_W = 0.5;

/** The Class 1 limit at a wavelength (W), or null where this table does not reach. From memory; see above. */
export function class1LimitW(wavelengthNm: number): number | null {
  const l = wavelengthNm;
  if (l < VISIBLE_NM[0] || l > 4000) return null;
  if (l <= VISIBLE_NM[1]) return VISIBLE_CLASS1_W;
  if (l <= 1050) return VISIBLE_CLASS1_W * 10 ** (0.002 * (l - 700));
  if (l <= 1400) {
    const c7 = l <= 1150 ? 1 : l <= 1200 ? 10 ** (0.018 * (l - 1150)) : 8 + 10 ** (0.04 * (l - 1250));
    return VISIBLE_CLASS1_W * 5 * c7;
  }
  return 1e-2;
}

/** Within this fraction below a class's upper limit, the label says the line is near it (beam size and tolerances move the class). */
const NEAR_LIMIT = 0.8;

function withNearNote(cls: string, powerW: number, limitW: number, next: string): string {
  return powerW > NEAR_LIMIT * limitW ? `${cls} (near the Class ${next} limit)` : cls;
}

/**
 * An indicative hazard class for a continuous-wave line from its wavelength and power alone,
 * with the limits above (IEC 60825-1, from memory). 10 mW at 1550 nm is Class 1, at the edge of
 * it; the same 10 mW at 633 nm is 3B. Pulsing, beam size (the "M" classes) and the measurement
 * conditions move these limits: the laser's label and the laser safety officer decide.
 */
export function indicativeLaserClass(wavelengthNm: number, powerW: number | null): string {
  if (powerW === null) return "unknown (no power given)";
  const class1 = class1LimitW(wavelengthNm);
  if (class1 === null) return powerW > CLASS3B_W ? "4" : "unknown at this wavelength — see the label";
  const visible = wavelengthNm >= VISIBLE_NM[0] && wavelengthNm <= VISIBLE_NM[1];
  const class3r = 5 * (visible ? CLASS2_W : class1);
  if (powerW > CLASS3B_W) return "4";
  if (powerW > class3r) return withNearNote("3B", powerW, CLASS3B_W, "4");
  if (visible && powerW >= CLASS2_W) return withNearNote("3R", powerW, class3r, "3B");
  if (visible && powerW > class1) return "2";
  if (powerW > class1) return withNearNote("3R", powerW, class3r, "3B");
  return withNearNote("1", powerW, class1, visible ? "2" : "3R");
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
