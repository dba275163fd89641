/*
 * Command line: `npm run --silent material -- list` prints the library's { id, name } as JSON;
 * `npm run --silent material -- ID` prints that material's parameter file, sources and validity.
 * Unknown id or bad usage: one line on stderr, exit status 2. Logic in lib/materials/cli.ts.
 */
import { runMaterialCli } from "../lib/materials/cli";

const outcome = runMaterialCli(process.argv.slice(2));
process.stdout.write(outcome.stdout);
process.stderr.write(outcome.stderr);
process.exitCode = outcome.status;
