"use client";

import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { fmt } from "@/lib/workbench/format";
import type { ComputedSpectrum, RunStatus } from "./use-spectrum-run";

/** 4π × 10⁻⁷ (CODATA 2018 μ0 = 1.25663706212e-6 N/A²), to show μ0·M0 in tesla. */
const MU0 = 1.25663706212e-6;

export function numericalBadgeText(deviation: number | undefined): string {
  return `numerical, max deviation from linear response: ${deviation === undefined ? "–" : deviation.toExponential(1)}`;
}

export function RunStatusBar({
  status,
  progress,
  error,
  shown,
  pending,
  invalid,
  scaleLabel,
  onCancel,
  onRerun,
}: {
  status: RunStatus;
  progress: number;
  error: string | null;
  shown: ComputedSpectrum | null;
  pending: boolean;
  invalid: boolean;
  scaleLabel: string | null;
  onCancel: () => void;
  onRerun: () => void;
}) {
  const percent = Math.round(progress * 100);
  const running = status === "running";
  const m0 = shown?.result.magnetizationAPerM;
  const warnings = shown?.result.warnings ?? [];
  let statusText: string;
  if (invalid) statusText = "Some inputs are out of range; nothing is computed until they are fixed.";
  else if (pending) statusText = "Waiting for you to finish typing…";
  else if (running) statusText = `Numerical LLG run: ${percent} % done`;
  else if (status === "cancelled") statusText = "Numerical run cancelled. The analytic preview is on screen.";
  else if (status === "failed") statusText = "Numerical run failed.";
  else if (status === "done") statusText = "Numerical run finished.";
  else statusText = "Ready.";

  return (
    <section aria-label="Run status" className="space-y-3 rounded-lg border border-ink/10 bg-paper-raised p-4">
      <div className="flex flex-wrap items-center gap-3">
        <div className="min-w-48 flex-1">
          <div className="flex items-center justify-between text-xs text-ink-soft">
            <span id="run-progress-label">Numerical run progress</span>
            <span aria-hidden="true" className="tabular-nums">
              {percent} %
            </span>
          </div>
          <div
            role="progressbar"
            aria-labelledby="run-progress-label"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={percent}
            aria-valuetext={`${percent} %`}
            className="mt-1 h-2 overflow-hidden rounded-full bg-paper-sunk"
          >
            <div className="h-full bg-lux transition-[width] duration-150" style={{ width: `${percent}%` }} />
          </div>
        </div>
        <Button variant="secondary" onClick={onCancel} disabled={!running}>
          Cancel
        </Button>
        {status === "cancelled" || status === "failed" ? (
          <Button variant="secondary" onClick={onRerun}>
            Run numerical again
          </Button>
        ) : null}
      </div>
      <p role="status" aria-live="polite" className="text-sm text-ink-soft">
        {statusText}
      </p>
      <div className="flex flex-wrap items-center gap-2 text-xs">
        {shown?.method === "llg" ? (
          <span data-testid="numerical-badge" className="rounded-full border border-lux bg-lux-light px-2.5 py-1 font-medium text-lux-dark">
            {numericalBadgeText(shown.result.maxRelDeviationFromAnalytic)}
          </span>
        ) : shown ? (
          <span className="rounded-full border border-ink/20 bg-paper-sunk px-2.5 py-1 text-ink-soft">
            analytic preview
            {shown.result.points.length < shown.requestedPoints
              ? ` on ${shown.result.points.length} of ${shown.requestedPoints} points`
              : ""}
          </span>
        ) : null}
        {scaleLabel ? (
          <span
            data-testid="magnetic-scale-label"
            className="rounded-full border border-ember bg-ember-light px-2.5 py-1 font-semibold text-ember"
          >
            {scaleLabel}
          </span>
        ) : null}
        {m0 !== undefined ? (
          <span className="rounded-full border border-ink/15 px-2.5 py-1 text-ink-soft">
            M0 = {fmt(m0)} A/m (μ0M0 = {fmt(MU0 * m0)} T) · source: mean-field Brillouin from N, g, J, θCW (long rod, no demagnetizing
            field)
          </span>
        ) : null}
      </div>
      {error ? (
        <Alert tone="warning" title="Run failed">
          {error}
        </Alert>
      ) : null}
      {warnings.length > 0 ? (
        <Alert tone="warning" title="Passivity warning">
          <ul className="list-disc pl-5">
            {warnings.slice(0, 4).map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
          {warnings.length > 4 ? <p>…and {warnings.length - 4} more.</p> : null}
        </Alert>
      ) : null}
    </section>
  );
}
