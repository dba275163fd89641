/*
 * Command line: `npm run --silent spectrum -- FILE.json` reads a parameter file (the keys of
 * spectrumRequestSchema, unknown keys rejected) and prints the spectrum as JSON on stdout.
 * Errors: exit status 2 and one line on stderr naming the field and the rule it broke.
 * Passivity and other warnings: lines starting "warning:" on stderr, a "warnings" array in the
 * JSON, exit status 0. Same code as the web worker (lib/physics/spectrum.ts).
 */
import { readFileSync } from "node:fs";
import { NonFiniteResultError, SpectrumInputError, computeSpectrum, parseSpectrumRequest } from "../lib/physics/spectrum";

const oneLine = (s: string) => s.replace(/\s*[\r\n]+\s*/g, " ").trim();

function fail(message: string, status = 2): void {
  process.stderr.write(`${oneLine(message)}\n`);
  process.exitCode = status;
}

function main(argv: string[]): void {
  const files = argv.filter((a) => a !== "--");
  if (files.length !== 1) {
    fail("usage: npm run --silent spectrum -- FILE.json");
    return;
  }
  const file = files[0]!;
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    fail(`${file}: cannot read the parameter file (${code === "ENOENT" ? "no such file" : (code ?? (err as Error).message)})`);
    return;
  }
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (err) {
    fail(`${file}: malformed JSON (${(err as Error).message})`);
    return;
  }
  const parsed = parseSpectrumRequest(input);
  if (!parsed.ok) {
    fail(parsed.issues.join("; "));
    return;
  }
  try {
    const result = computeSpectrum(parsed.request);
    for (const w of result.warnings ?? []) process.stderr.write(`warning: ${oneLine(w)}\n`);
    process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  } catch (err) {
    if (err instanceof SpectrumInputError || err instanceof NonFiniteResultError) fail(err.message);
    else fail(`internal error: ${(err as Error).message}`, 1);
  }
}

main(process.argv.slice(2));
