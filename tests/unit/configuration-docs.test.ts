import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { readBuildSettings } from "@/lib/settings/build.mjs";

/*
 * Every environment variable the scripts, the settings module (lib/settings), the Next config and
 * the tests read is documented in the README's configuration table and in .env.example.
 */

const ROOT = path.resolve(__dirname, "../..");

function filesUnder(dir: string, ext: RegExp): string[] {
  const out: string[] = [];
  for (const name of readdirSync(path.join(ROOT, dir))) {
    const rel = path.join(dir, name);
    if (statSync(path.join(ROOT, rel)).isDirectory()) out.push(...filesUnder(rel, ext));
    else if (ext.test(name)) out.push(rel);
  }
  return out;
}

/** Upper-case names read as `${NAME…}` / `$NAME` in shell or `process.env.NAME` in TypeScript. */
function variablesRead(file: string): string[] {
  const text = readFileSync(path.join(ROOT, file), "utf8");
  const names = new Set<string>();
  if (file.endsWith(".sh")) {
    // Only names with a default (`${NAME:-…}`) or exported by the caller are configuration.
    for (const m of text.matchAll(/\$\{([A-Z][A-Z0-9_]+):-/g)) names.add(m[1]!);
  } else {
    for (const m of text.matchAll(/process\.env\.([A-Z][A-Z0-9_]+)/g)) names.add(m[1]!);
  }
  return [...names];
}

const SOURCES = [
  ...filesUnder("scripts", /\.sh$/),
  "db/pg.sh",
  "next.config.mjs",
  ...filesUnder("tests", /\.ts$/).filter((f) => !f.endsWith("configuration-docs.test.ts")),
];

/** The settings module's fragments (zod object keys, one per line); the declaration file has none. */
const SETTINGS_FILES = filesUnder("lib/settings", /\.(ts|mjs)$/);

function settingsKeys(): string[] {
  return SETTINGS_FILES.flatMap((file) => {
    const text = readFileSync(path.join(ROOT, file), "utf8");
    return [...text.matchAll(/^\s+([A-Z][A-Z0-9_]+):/gm)].map((m) => m[1]!);
  });
}

/** Product code, which reads the environment only through lib/settings. */
const PRODUCT_CODE = [
  ...["app", "components", "lib", "db", "workers"].flatMap((dir) => filesUnder(dir, /\.(ts|tsx|mts|mjs|js)$/)),
  "proxy.ts",
  "next.config.mjs",
  "drizzle.config.ts",
].filter((file) => !file.startsWith("lib/settings/"));

describe("configuration documentation", () => {
  const readme = readFileSync(path.join(ROOT, "README.md"), "utf8");
  const example = readFileSync(path.join(ROOT, ".env.example"), "utf8");
  const variables = [...new Set([...SOURCES.flatMap(variablesRead), ...settingsKeys()])];

  it("finds the variables it should (the check itself works)", () => {
    expect(variables).toEqual(expect.arrayContaining(["GYROLUX_TEST_PG_PORT", "GYROLUX_PG_PORT", "DATABASE_URL", "GYROLUX_NEXT_DIST_DIR"]));
    expect(variables).toEqual(
      expect.arrayContaining([
        "AUTH_SECRET",
        "NODE_ENV",
        "GYROLUX_S3_BUCKET",
        "GYROLUX_SMTP_PORT",
        "GYROLUX_RUN_POLL_S",
        "GYROLUX_ADMIN_PASSWORD",
      ]),
    );
  });

  it("reads the environment only in lib/settings", () => {
    expect(PRODUCT_CODE).toEqual(expect.arrayContaining(["lib/auth/client-ip.ts", "db/client.ts", "workers/lab-runs/main.ts"]));
    const readers = PRODUCT_CODE.filter((file) => readFileSync(path.join(ROOT, file), "utf8").includes("process.env"));
    expect(readers).toEqual([]);
  });

  it.each(variables)("documents %s in the README's configuration table", (name) => {
    // The name alone in the first cell (a padded table, one space or more, reads the same).
    expect(readme).toMatch(new RegExp(`^\\| \`${name}\` +\\|`, "m"));
  });

  it.each(variables.filter((n) => n !== "NODE_ENV" && n !== "TMPDIR"))("lists %s in .env.example", (name) => {
    // A variable that is unset by default (a secret, a name) is listed commented out.
    expect(example).toMatch(new RegExp(`^(# )?${name}=`, "m"));
  });

  it("builds the tests into their own folder", () => {
    const config = readFileSync(path.join(ROOT, "next.config.mjs"), "utf8");
    expect(config).toMatch(/distDir:\s*buildSettings\.nextDistDir/);
    expect(readBuildSettings({ GYROLUX_NEXT_DIST_DIR: ".next-test" }).nextDistDir).toBe(".next-test");
    expect(readBuildSettings({}).nextDistDir).toBe(".next");
    const testScript = readFileSync(path.join(ROOT, "scripts/test.sh"), "utf8");
    expect(testScript).toMatch(/GYROLUX_NEXT_DIST_DIR="\$\{GYROLUX_TEST_NEXT_DIST_DIR:-\.next-test\}"/);
  });
});
