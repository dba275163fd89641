import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

/*
 * Every environment variable the scripts, the server's env module, the Next config and the tests
 * read is documented in the README's configuration table and in .env.example.
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
  "db/script-env.ts",
  "drizzle.config.ts",
];

function envModuleKeys(): string[] {
  const text = readFileSync(path.join(ROOT, "lib/env.ts"), "utf8");
  const body = text.slice(text.indexOf("z.object({"), text.indexOf("});"));
  return [...body.matchAll(/^\s+([A-Z][A-Z0-9_]+):/gm)].map((m) => m[1]!);
}

describe("configuration documentation", () => {
  const readme = readFileSync(path.join(ROOT, "README.md"), "utf8");
  const example = readFileSync(path.join(ROOT, ".env.example"), "utf8");
  const variables = [...new Set([...SOURCES.flatMap(variablesRead), ...envModuleKeys()])];

  it("finds the variables it should (the check itself works)", () => {
    expect(variables).toEqual(expect.arrayContaining(["GYROLUX_TEST_PG_PORT", "GYROLUX_PG_PORT", "DATABASE_URL", "GYROLUX_NEXT_DIST_DIR"]));
  });

  it.each(variables)("documents %s in the README's configuration table", (name) => {
    // The name alone in the first cell; the formatter pads the cells to the column's width.
    expect(readme).toMatch(new RegExp(`^\\| \`${name}\` +\\|`, "m"));
  });

  it.each(variables.filter((n) => n !== "NODE_ENV" && n !== "TMPDIR"))("lists %s in .env.example", (name) => {
    // A variable that is unset by default (a secret, a name) is listed commented out.
    expect(example).toMatch(new RegExp(`^(# )?${name}=`, "m"));
  });

  it("builds the tests into their own folder", () => {
    const config = readFileSync(path.join(ROOT, "next.config.mjs"), "utf8");
    expect(config).toMatch(/distDir:\s*process\.env\.GYROLUX_NEXT_DIST_DIR/);
    const testScript = readFileSync(path.join(ROOT, "scripts/test.sh"), "utf8");
    expect(testScript).toMatch(/GYROLUX_NEXT_DIST_DIR="\$\{GYROLUX_TEST_NEXT_DIST_DIR:-\.next-test\}"/);
  });
});
