import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { loadEnvFile, readEnvFile } from "@/lib/settings/env-file.mjs";

const ROOT = path.resolve(__dirname, "../../..");

function envFile(text: string): string {
  const dir = mkdtempSync(path.join(tmpdir(), "gyrolux-env-"));
  const file = path.join(dir, ".env");
  writeFileSync(file, text);
  return file;
}

const SAMPLE = [
  "# a comment",
  "GYROLUX_PG_PORT=54400",
  "GYROLUX_MAIL_FROM=Gyrolux <no-reply@lab.example>",
  `GYROLUX_SMTP_PASS='it''s $HOME; rm -rf /'`,
  "DATABASE_URL=postgres://u:p@db:5432/g?sslmode=verify-full",
  "",
].join("\n");

describe("the .env loader", () => {
  it("fills in what the environment does not set, and leaves what it sets", () => {
    const file = envFile(SAMPLE);
    const target: Record<string, string | undefined> = { GYROLUX_PG_PORT: "1234" };
    const loaded = loadEnvFile(target, file);
    expect(target.GYROLUX_PG_PORT).toBe("1234");
    expect(target.GYROLUX_MAIL_FROM).toBe("Gyrolux <no-reply@lab.example>");
    expect(target.DATABASE_URL).toBe("postgres://u:p@db:5432/g?sslmode=verify-full");
    expect(loaded).not.toContain("GYROLUX_PG_PORT");
    expect(loaded).toContain("GYROLUX_MAIL_FROM");
  });

  it("a missing file is no error", () => {
    expect(readEnvFile(path.join(tmpdir(), "no-such-dir-gyrolux", ".env"))).toEqual({});
  });

  it("bash, through scripts/env.sh's loader, reads every value exactly as Node does (spaces, quotes, $, ;)", () => {
    const file = envFile(SAMPLE);
    const want = readEnvFile(file);
    const names = ["GYROLUX_PG_PORT", "GYROLUX_MAIL_FROM", "GYROLUX_SMTP_PASS", "DATABASE_URL"];
    const script = `eval "$(node lib/settings/env-file.mjs '${file}')"; printf '%s\\0' ${names.map((n) => `"$${n}"`).join(" ")}`;
    // This process's environment without the names under test, so the file supplies them.
    const env: NodeJS.ProcessEnv = { ...process.env };
    for (const name of names) delete env[name];
    const out = spawnSync("bash", ["-c", script], { cwd: ROOT, env, encoding: "utf8" });
    expect(out.status, out.stderr).toBe(0);
    expect(out.stdout.split("\0").slice(0, 4)).toEqual([
      want.GYROLUX_PG_PORT,
      want.GYROLUX_MAIL_FROM,
      want.GYROLUX_SMTP_PASS,
      want.DATABASE_URL,
    ]);
    const kept = spawnSync("bash", ["-c", script], { cwd: ROOT, env: { ...env, GYROLUX_PG_PORT: "999" }, encoding: "utf8" });
    expect(kept.stdout.split("\0")[0]).toBe("999");
  });
});
