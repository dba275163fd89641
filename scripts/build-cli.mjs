/*
 * Builds the command lines and the lab-run worker into dist/ with esbuild, once, so they start
 * as plain JavaScript (no TypeScript transpiling at every start). A target is rebuilt only when
 * one of its inputs (recorded in dist/<target>.inputs.json from esbuild's metafile) is newer than
 * its output, so the check costs a few file stats.
 *
 *   node scripts/build-cli.mjs            build every stale target
 *   node scripts/build-cli.mjs --worker-bundle [DIR]   the self-contained worker folder (npm run build:worker)
 *   import { ensureBuilt } from "./build-cli.mjs"; await ensureBuilt("spectrum")
 */
import { existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const dist = path.join(root, "dist");

/**
 * entry → output. The spectrum command line bundles its dependencies too (one file to load); the
 * worker keeps node_modules external (pg, pg-boss, drizzle-orm are loaded from there).
 */
export const TARGETS = {
  spectrum: { entry: "scripts/spectrum.ts", bundleDeps: true },
  fit: { entry: "scripts/fit.ts", bundleDeps: true },
  plan: { entry: "scripts/plan.ts", bundleDeps: true },
  material: { entry: "scripts/material.ts", bundleDeps: true },
  "lab-worker": { entry: "workers/lab-runs/main.ts", bundleDeps: false },
  "lab-worker-thread": { entry: "workers/lab-runs/thread.ts", bundleDeps: true },
};

const outFile = (name) => path.join(dist, `${name}.mjs`);
const inputsFile = (name) => path.join(dist, `${name}.inputs.json`);

function isStale(name) {
  const out = outFile(name);
  if (!existsSync(out) || !existsSync(inputsFile(name))) return true;
  const built = statSync(out).mtimeMs;
  let inputs;
  try {
    inputs = JSON.parse(readFileSync(inputsFile(name), "utf8"));
  } catch {
    return true;
  }
  for (const file of inputs) {
    try {
      if (statSync(path.join(root, file)).mtimeMs > built) return true;
    } catch {
      return true;
    }
  }
  return false;
}

/** esbuild's options for one entry point written to `outfile`. */
function buildOptions(entry, outfile, bundleDeps) {
  return {
    absWorkingDir: root,
    entryPoints: [entry],
    outfile,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    packages: bundleDeps ? undefined : "external",
    // CommonJS dependencies bundled into an ES module need a require of their own.
    banner: {
      js: 'import { createRequire as __glxCreateRequire } from "node:module"; const require = __glxCreateRequire(import.meta.url);',
    },
    metafile: true,
    logLevel: "warning",
    legalComments: "none",
    // A smaller file parses faster: at start-up Node spends most of a one-wavelength call compiling
    // the bundle (measured with --cpu-prof), so the command line is minified.
    minify: true,
    keepNames: true,
    write: false,
    // pg's optional native binding is loaded only when asked for (pg.native); never here.
    external: ["pg-native"],
  };
}

async function build(name) {
  const { entry, bundleDeps } = TARGETS[name];
  const esbuild = await import("esbuild");
  mkdirSync(dist, { recursive: true });
  const result = await esbuild.build(buildOptions(entry, outFile(name), bundleDeps));
  // Written under a temporary name and renamed, so a process building at the same moment (tests
  // run in parallel) never sees half a file.
  for (const file of result.outputFiles) {
    const tmp = `${file.path}.${process.pid}.tmp`;
    writeFileSync(tmp, file.contents);
    renameSync(tmp, file.path);
  }
  const inputs = Object.keys(result.metafile.inputs).filter((f) => !f.startsWith("node_modules/"));
  const tmp = `${inputsFile(name)}.${process.pid}.tmp`;
  writeFileSync(tmp, JSON.stringify([...inputs, "package-lock.json", "scripts/build-cli.mjs"]));
  renameSync(tmp, inputsFile(name));
}

/**
 * `npm run build:worker`: the lab-run worker as one folder that runs with plain `node`, every
 * dependency (pg, pg-boss, drizzle-orm, zod, the physics) bundled in, so a lab PC needs Node 20 and
 * this folder only: `node lab-worker.mjs` with DATABASE_URL (or a .env beside it). Returns the
 * folder's files and their total size in bytes.
 */
export async function buildWorkerBundle(outDir = path.join(dist, "worker")) {
  const esbuild = await import("esbuild");
  mkdirSync(outDir, { recursive: true });
  const files = [];
  for (const [name, entry] of [
    ["lab-worker", TARGETS["lab-worker"].entry],
    ["lab-worker-thread", TARGETS["lab-worker-thread"].entry],
  ]) {
    const result = await esbuild.build({ ...buildOptions(entry, path.join(outDir, `${name}.mjs`), true), write: true });
    if (result.errors.length > 0) throw new Error(`esbuild failed for ${name}`);
    files.push(`${name}.mjs`);
  }
  const version = JSON.parse(readFileSync(path.join(root, "package.json"), "utf8")).version;
  writeFileSync(
    path.join(outDir, "package.json"),
    `${JSON.stringify({ name: "gyrolux-lab-worker", version, private: true, type: "module", engines: { node: ">=20" } }, null, 2)}\n`,
  );
  files.push("package.json");
  const bytes = files.reduce((sum, f) => sum + statSync(path.join(outDir, f)).size, 0);
  return { outDir, files, bytes };
}

/** Builds the named targets that are stale; returns the names built. */
export async function ensureBuilt(...names) {
  const built = [];
  for (const name of names) {
    if (!(name in TARGETS)) throw new Error(`unknown build target ${name}`);
    if (isStale(name)) {
      await build(name);
      built.push(name);
    }
  }
  return built;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href && process.argv[2] === "--worker-bundle") {
  const { outDir, files, bytes } = await buildWorkerBundle(process.argv[3] ? path.resolve(process.argv[3]) : undefined);
  process.stderr.write(
    `[build] self-contained lab-run worker in ${path.relative(process.cwd(), outDir) || outDir}: ${files.join(", ")} ` +
      `(${(bytes / 1e6).toFixed(2)} MB). Copy the folder to a lab PC with Node 20 and run: node lab-worker.mjs\n`,
  );
} else if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const names = process.argv.slice(2).length > 0 ? process.argv.slice(2) : Object.keys(TARGETS);
  const started = Date.now();
  const built = await ensureBuilt(...names);
  process.stderr.write(built.length > 0 ? `[build] ${built.join(", ")} built into dist/ in ${Date.now() - started} ms\n` : "");
}
