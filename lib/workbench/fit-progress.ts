import type { FitRunProgress } from "@/lib/fit/worker-api";
import { fmt } from "./format";

/*
 * How far a fit and its report have come, for the panel's progress bar: the fit's iterations have
 * no known end, so the first part of the bar fills ever more slowly; the report's stages after it
 * (comparison, nested models, profiles, share intervals) each own a fixed part of the bar.
 */

const STAGES = {
  comparison: { from: 0.3, to: 0.4, text: "Refitting with magneticScale held at 0 and at 1" },
  nested: { from: 0.4, to: 0.45, text: "Checking the fit against the models nested in it" },
  profile: { from: 0.45, to: 0.55, text: "Profiling magneticScale" },
  share: { from: 0.55, to: 0.95, text: "Profiling the magnetic share" },
  restsOn: { from: 0.95, to: 1, text: "Checking whether the evidence rests on a held value" },
} as const;

export function fitProgressView(progress: FitRunProgress | null): { fraction: number; text: string } {
  if (!progress) return { fraction: 0, text: "Starting the fit worker…" };
  if (progress.kind === "fit") {
    return {
      fraction: (0.3 * progress.iteration) / (progress.iteration + 6),
      text: `Fit: iteration ${progress.iteration}, χ² = ${fmt(progress.chi2)}`,
    };
  }
  const s = STAGES[progress.stage];
  const part = progress.total > 0 ? progress.done / progress.total : 0;
  const count = progress.stage === "share" ? `: ${progress.done} of ${progress.total} conditions` : "";
  return { fraction: s.from + (s.to - s.from) * part, text: `${s.text}${count}` };
}
