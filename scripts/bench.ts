/*
 * Benchmark (not a test): 256-wavelength terbium-garnet spectrum, 300–3000 nm, 293.15 K, 1 T
 * (physics-model.md §9 parameters), single-threaded. Prints the median time of several runs after
 * a JIT warm-up for the numerical (LLG) and analytic paths, and the largest numerical-vs-analytic
 * relative deviation of χ±. Targets: numerical ≤ 100 ms at ≤ 1e-4, analytic ≤ 2 ms.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";
import type { SpectrumRequest } from "../lib/physics/schema";
import { computeSpectrum } from "../lib/physics/spectrum";

const wavelengthsNm = Array.from({ length: 256 }, (_, i) => 300 + (2700 * i) / 255);
const tgg: Omit<SpectrumRequest, "method"> = { ...TERBIUM_GARNET_DEFAULTS, wavelengthsNm };

/** Median and fastest wall time of `repeats` runs after `warmup` runs (the fastest is the least disturbed by other load). */
function timeMs(run: () => void, warmup: number, repeats: number): { median: number; min: number; cpuMedian: number } {
  for (let i = 0; i < warmup; i++) run();
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  return { median: times[Math.floor(times.length / 2)]!, min: times[0]!, cpuMedian: cpu[Math.floor(cpu.length / 2)]! };
}

let deviation = Number.NaN;
const llg = timeMs(
  () => {
    deviation = computeSpectrum({ ...tgg, method: "llg" }).maxRelDeviationFromAnalytic ?? Number.NaN;
  },
  3,
  9,
);
const analytic = timeMs(() => computeSpectrum({ ...tgg, method: "analytic" }), 20, 51);

console.log(
  `numerical (llg) spectrum, 256 wavelengths 300–3000 nm, single thread: ${llg.median.toFixed(1)} ms median of 9, ` +
    `fastest ${llg.min.toFixed(1)} ms (target ≤ 100 ms)`,
);
console.log(
  `analytic spectrum, 256 wavelengths: ${analytic.median.toFixed(3)} ms median of 51, ` +
    `fastest ${analytic.min.toFixed(3)} ms (target ≤ 2 ms)`,
);
console.log(`largest numerical-vs-analytic relative deviation of χ±: ${deviation.toExponential(2)} (target ≤ 1e-4)`);

/*
 * Cold start of the command line (whole process, as users run it): `node dist/spectrum.mjs` (the
 * build that `npm run spectrum` runs) for 1 and for 256 wavelengths. The difference is what the
 * first numerical spectrum costs in a fresh process beyond loading; the target is within 2× of the
 * warm figure above, and one wavelength's whole call under 300 ms.
 */

spawnSync(process.execPath, ["scripts/build-cli.mjs", "spectrum"], { stdio: "inherit" });
const dir = mkdtempSync(join(tmpdir(), "gyrolux-bench-"));
const file = (name: string, wl: number[]) => {
  const path = join(dir, `${name}.json`);
  writeFileSync(path, JSON.stringify({ ...tgg, method: "llg", wavelengthsNm: wl }));
  return path;
};
const one = file("one", [632.8]);
const many = file("many", wavelengthsNm);
// CPU time (user + system) of the child as well as its wall time, when /usr/bin/time exists: on a
// machine shared with other work the CPU figure moves much less than the wall time.
const TIME_BIN = existsSync("/usr/bin/time") ? "/usr/bin/time" : null;
const cpuMs: Record<string, number[]> = {};
function wallMs(args: string[], label?: string): number {
  const cmd = TIME_BIN && label ? [TIME_BIN, "-f", "cpu %U %S", ...args] : args;
  const t0 = performance.now();
  const r = spawnSync(cmd[0]!, cmd.slice(1), { encoding: "utf8" });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${args.join(" ")} failed: ${r.stderr}`);
  const m = TIME_BIN && label ? /cpu ([\d.]+) ([\d.]+)\s*$/.exec(r.stderr) : null;
  if (m && label) {
    cpuMs[label] ??= [];
    cpuMs[label].push((Number(m[1]) + Number(m[2])) * 1000);
  }
  return ms;
}
/** The 1-, 5- and 15-minute load averages (Linux): on a shared machine the cold figures move with them. */
const loadAverage = (): string => {
  try {
    return readFileSync("/proc/loadavg", "utf8").split(" ").slice(0, 3).join(" ");
  } catch {
    return "unknown";
  }
};
const loadBefore = loadAverage();
const ROUNDS = 11;
const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const coldOne: number[] = [];
const coldMany: number[] = [];
const node0: number[] = [];
// Interleaved, so a change in the machine's load hits both the same way.
for (let i = 0; i < ROUNDS; i++) {
  node0.push(wallMs([process.execPath, "-e", "0"], "node0"));
  coldOne.push(wallMs([process.execPath, "dist/spectrum.mjs", one], "one"));
  coldMany.push(wallMs([process.execPath, "dist/spectrum.mjs", many], "many"));
}
const diffs = coldMany.map((m, i) => m - coldOne[i]!);
console.log(
  `cold command line, whole process: 256 wavelengths ${med(coldMany).toFixed(0)} ms, ` +
    `1 wavelength ${med(coldOne).toFixed(0)} ms (median of ${ROUNDS}); ` +
    `256 − 1 = ${med(diffs).toFixed(0)} ms (fastest ${Math.min(...diffs).toFixed(0)} ms) ` +
    `vs warm ${llg.median.toFixed(1)} ms (target ≤ 2× warm)`,
);
console.log(
  `one wavelength, whole command-line call (node dist/spectrum.mjs): ${med(coldOne).toFixed(0)} ms median, ` +
    `fastest ${Math.min(...coldOne).toFixed(0)} ms (target < 300 ms); bare \`node -e 0\` here: ${med(node0).toFixed(0)} ms`,
);
console.log(`load average (1, 5, 15 min) before the command-line rounds: ${loadBefore}; after: ${loadAverage()}`);
if (cpuMs.one && cpuMs.many && cpuMs.node0) {
  const cpuDiff = cpuMs.many.map((m, i) => m - cpuMs.one![i]!);
  console.log(
    `the same as CPU time (user + system, all threads): 256 − 1 = ${med(cpuDiff).toFixed(0)} ms ` +
      `vs warm ${llg.cpuMedian.toFixed(0)} ms; 1 wavelength ${med(cpuMs.one).toFixed(0)} ms; bare node ${med(cpuMs.node0).toFixed(0)} ms`,
  );
}
