#!/usr/bin/env node
/*
 * The line-length limit of the code (140 columns, as the formatter's lineWidth in biome.json).
 * The formatter wraps code but leaves long comments and strings alone, so this check covers them.
 */
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";

const LIMIT = 140;
const files = execFileSync("git", ["ls-files", "-co", "--exclude-standard", "*.ts", "*.tsx", "*.mts", "*.mjs", "*.cjs"], {
  encoding: "utf8",
})
  .split("\n")
  .filter((file) => file !== "" && !file.startsWith("drizzle/meta/"));

let over = 0;
for (const file of files) {
  let text;
  try {
    text = readFileSync(file, "utf8");
  } catch {
    continue; // listed by git but deleted in the working tree
  }
  text.split("\n").forEach((line, index) => {
    // Code points, not UTF-16 units: "σ" and "λ" are one column each.
    const length = [...line].length;
    if (length > LIMIT) {
      over++;
      console.error(`${file}:${index + 1}: ${length} characters (limit ${LIMIT})`);
    }
  });
}
if (over > 0) {
  console.error(`${over} line(s) longer than ${LIMIT} characters.`);
  process.exit(1);
}
