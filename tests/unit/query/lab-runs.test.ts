import { describe, expect, it } from "vitest";
import { etaSeconds } from "@/lib/query/lab-runs";

const started = "2026-01-01T00:00:00.000Z";
const at = (s: number) => Date.parse(started) + s * 1000;

describe("time left of a lab run", () => {
  it("from the pace of this attempt: 25 % in 10 s leaves 30 s", () => {
    expect(etaSeconds({ state: "running", progress: 0.25, startedAt: started }, at(10))).toBeCloseTo(30, 9);
  });

  it("a resumed attempt counts only what it computed itself, not the saved chunks it began with", () => {
    // Began at 50 % from checkpoints, 60 % after 10 s: 10 % per 10 s, so 40 s for the last 40 %.
    expect(etaSeconds({ state: "running", progress: 0.6, progressAtStart: 0.5, startedAt: started }, at(10))).toBeCloseTo(40, 9);
    expect(etaSeconds({ state: "running", progress: 0.51, progressAtStart: 0.5, startedAt: started }, at(10))).toBeNull();
  });

  it("none for a run that is not running", () => {
    expect(etaSeconds({ state: "queued", progress: 0.5, startedAt: started }, at(10))).toBeNull();
  });
});
