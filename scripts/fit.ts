/*
 * Command line: `npm run --silent fit -- --params P.json --data D.csv [--data E.csv …] [--free a,b,c]
 * [--prior KEY=MEAN:SIGMA …] [--starts N] [--seed N] [--magnitudes] [--scale-by-chi2] [--no-share-intervals]` fits the model
 * (analytic path) to the measured points (several --data files: one global fit, each file a
 * measurement set) and prints JSON on stdout: { free, values, sigmas, correlation, chi2, dof,
 * assumptions, comparison (when magneticScale is free), informationCriteria, goodnessOfFit, profile,
 * verdict, points: [{ set, wavelengthNm, measured, sigma, model, magneticShare, magneticShareSigma,
 * magneticShareInterval68 }], shareCovariance }. values and sigmas include parameters that carry only
 * a prior. σ are as given by the data unless --scale-by-chi2. Bad input: exit status 2 and one line on
 * stderr naming the problem. Notes on the result (the parts are not separated and why, a parameter
 * ended on a bound, the signs look like magnitudes) are "warning:" lines on stderr.
 * Same fitting module as the web worker and the API (lib/fit/report.ts).
 */
import { readFileSync } from "node:fs";
import { runFitCommand } from "../lib/fit/cli-input";

const run = runFitCommand(process.argv.slice(2), (path) => readFileSync(path, "utf8"));
if (run.stderr) process.stderr.write(run.stderr);
if (run.stdout) process.stdout.write(run.stdout);
process.exitCode = run.status;
