import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

/*
 * The access proof (lib/contracts/access.ts) only means something if nothing else can make one
 * and no query of a lab's data can be called without one. The type system enforces the second
 * for every query that asks for the proof; these checks keep the two doors shut that it cannot:
 * a cast to the proof type outside lib/auth/access.ts, and an exported query that takes a bare
 * lab id again.
 */

const ROOT = path.resolve(__dirname, "../../..");

function filesUnder(dir: string): string[] {
  return readdirSync(path.join(ROOT, dir), { withFileTypes: true, recursive: true })
    .filter((entry) => entry.isFile() && /\.(ts|tsx)$/.test(entry.name))
    .map((entry) => path.relative(ROOT, path.join(entry.parentPath, entry.name)));
}

const read = (file: string) => readFileSync(path.join(ROOT, file), "utf8");

describe("the access proof", () => {
  it("is made only by lib/auth/access.ts (no cast to it anywhere else)", () => {
    const code = ["app", "components", "lib", "db", "workers", "scripts"].flatMap(filesUnder);
    expect(code).toContain("lib/auth/access.ts");
    const casts = code.filter(
      (file) => file !== "lib/auth/access.ts" && /\bas\s+(unknown\s+as\s+)?(ResourceAccess|LabAccess)\b/.test(read(file)),
    );
    expect(casts).toEqual([]);
  });

  it("is what every exported query of db/queries takes instead of a bare lab id", () => {
    // resource-labs.ts is the lookup authorize() itself runs to make the proof.
    const queries = filesUnder("db/queries").filter((file) => !file.endsWith("resource-labs.ts"));
    expect(queries.length).toBeGreaterThan(10);
    const offenders: string[] = [];
    for (const file of queries) {
      for (const match of read(file).matchAll(/export async function (\w+)\(([\s\S]*?)\)\s*:\s*Promise/g)) {
        if (/\blabId\??:\s*string/.test(match[2] ?? "")) offenders.push(`${file}: ${match[1]}`);
      }
    }
    expect(offenders).toEqual([]);
  });
});
