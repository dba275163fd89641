/*
 * Command line: `npm run --silent fit -- --params P.json --data D.csv [--free a,b,c] [--scale-by-chi2]`
 * fits the model (analytic path) to the measured points and prints JSON on stdout:
 * { free, values, sigmas, correlation, chi2, dof, points: [{ wavelengthNm, measured, sigma, model,
 * magneticShare, magneticShareSigma }] }. σ are as given by the data unless --scale-by-chi2.
 * Bad input: exit status 2 and one line on stderr naming the problem. Notes on the result (the
 * parts cannot be separated, a parameter ended on a bound) are "warning:" lines on stderr.
 * Same fitting module as the web worker and the API (lib/fit/fit.ts).
 */
import { readFileSync } from "node:fs";
import { runFitCommand } from "../lib/fit/cli-input";

const run = runFitCommand(process.argv.slice(2), (path) => readFileSync(path, "utf8"));
if (run.stderr) process.stderr.write(run.stderr);
if (run.stdout) process.stdout.write(run.stdout);
process.exitCode = run.status;
