/*
 * The one .env loader of every program: the web server (Next reads .env itself, the same way), the
 * shell scripts (db/pg.sh, scripts/s3.sh, mail.sh, worker.sh, demo.sh, test.sh, through
 * scripts/env.sh) and the Node programs (db/migrate.ts, db/seed.ts, the lab-run worker, the command
 * lines, through ./scripts.ts). Plain JavaScript so that bash can run it with node before anything is
 * built. A variable already set in the environment wins over the file, as with Next; the file is
 * `.env` in the current folder unless a path is given, and a missing file is no error.
 *
 *   node lib/settings/env-file.mjs [FILE]   prints `export NAME='value'` lines for bash's eval
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { parseEnv } from "node:util";

/** The variables of `file` (Node's own .env parser: quotes, comments, `export` prefixes). */
export function readEnvFile(file = path.resolve(".env")) {
  if (!existsSync(file)) return {};
  return parseEnv(readFileSync(file, "utf8"));
}

/** The file's variables that `target` does not set yet, copied into it; returns their names. */
export function loadEnvFile(target = process.env, file = path.resolve(".env")) {
  const loaded = [];
  for (const [name, value] of Object.entries(readEnvFile(file))) {
    if (target[name] !== undefined) continue;
    target[name] = value;
    loaded.push(name);
  }
  return loaded;
}

/** `export NAME='value'` lines for the variables not yet set, quoted so bash reads every value as written. */
export function shellExports(file, env = process.env) {
  const quote = (v) => `'${v.replaceAll("'", "'\\''")}'`;
  return Object.entries(readEnvFile(file))
    .filter(([name]) => env[name] === undefined && /^[A-Za-z_][A-Za-z0-9_]*$/.test(name))
    .map(([name, value]) => `export ${name}=${quote(value)}`)
    .join("\n");
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const out = shellExports(path.resolve(process.argv[2] ?? ".env"));
  if (out) process.stdout.write(`${out}\n`);
}
