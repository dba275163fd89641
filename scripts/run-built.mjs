/*
 * Runs a built command line from dist/, building it first when its sources changed:
 *   node scripts/run-built.mjs spectrum FILE.json
 * One Node process: the staleness check is a few file stats, then the bundle is imported with
 * the target's own arguments in process.argv.
 */
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { TARGETS, ensureBuilt } from "./build-cli.mjs";

const name = process.argv[2];
if (!name || !(name in TARGETS)) {
  process.stderr.write(`usage: node scripts/run-built.mjs ${Object.keys(TARGETS).join("|")} [args…]\n`);
  process.exit(2);
}
if (name === "lab-worker") await ensureBuilt("lab-worker", "lab-worker-thread");
else await ensureBuilt(name);
process.argv.splice(2, 1);
const dist = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../dist");
await import(pathToFileURL(path.join(dist, `${name}.mjs`)).href);
