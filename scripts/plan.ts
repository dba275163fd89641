/*
 * Command line: `npm run --silent plan -- --params P.json [--points N] [--free a,b,c]
 * [--prior KEY=MEAN:SIGMA] [--criterion detect|share|scale|d-optimal] [--lines 405,532,…]
 * [--temperatures 293.15,77] [--fields 0.5,1] [--noise-rad X] [--relative-floor X]
 * [--min-transmission X]` plans measurements for the fit's analysis (lib/analysis/definition.ts)
 * and prints the best plan as JSON on stdout: { free, criterion, points: [{ wavelengthNm,
 * temperatureK, fieldT, repeats, predictedThetaRad, transmission, flags }], expected: { sigmas,
 * detectionSigma } }. The planner's notes are "note:" lines on stderr. Bad input: exit status 2
 * and one line on stderr naming the problem. Same planner as the web worker (lib/planner/plan.ts).
 */
import { readFileSync } from "node:fs";
import { runPlanCommand } from "../lib/planner/cli-input";

const run = runPlanCommand(process.argv.slice(2), (path) => readFileSync(path, "utf8"));
if (run.stderr) process.stderr.write(run.stderr);
if (run.stdout) process.stdout.write(run.stdout);
process.exitCode = run.status;
