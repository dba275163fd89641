"use client";

import { useEffect, useState } from "react";
import type { LabRunSummary } from "@/lib/contracts/lab-runs";
import { etaSeconds } from "@/lib/query/lab-runs";

const STATE_LABEL: Record<LabRunSummary["state"], string> = {
  queued: "Queued",
  running: "Running",
  done: "Done",
  failed: "Failed",
  cancelled: "Cancelled",
};

const STATE_CLASS: Record<LabRunSummary["state"], string> = {
  queued: "bg-paper-sunk text-ink",
  running: "bg-lux-light text-lux-dark",
  done: "bg-lux-light text-lux-dark",
  failed: "bg-paper-sunk text-ember",
  cancelled: "bg-paper-sunk text-ink-soft",
};

function formatEta(s: number): string {
  if (s < 60) return `${Math.ceil(s)} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${Math.round(s % 60)} s`;
  return `${Math.floor(s / 3600)} h ${Math.round((s % 3600) / 60)} min`;
}

/** State badge, and for a running run its progress bar and the time left. */
export function RunState({ run }: { run: LabRunSummary }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (run.state !== "running") return;
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, [run.state]);
  const eta = etaSeconds(run, now);
  const pct = Math.round(run.progress * 100);
  return (
    <div className="space-y-1" data-testid="run-state">
      <span className={`inline-block rounded px-2 py-0.5 text-xs font-semibold ${STATE_CLASS[run.state]}`}>
        {STATE_LABEL[run.state]}
        {run.state === "running" && run.cancelRequested ? " (stopping…)" : ""}
      </span>
      {run.state === "running" ? (
        <div className="flex items-center gap-2 text-xs tabular-nums text-ink-soft">
          <progress className="w-28" value={run.progress} max={1} aria-label={`Progress of ${run.title}`} />
          <span>{pct} %</span>
          <span>{eta === null ? "estimating time left…" : `about ${formatEta(eta)} left`}</span>
        </div>
      ) : null}
      {run.error && run.state !== "done" ? (
        <p className={`max-w-xs text-xs ${run.state === "failed" ? "text-ember" : "text-ink-soft"}`}>{run.error}</p>
      ) : null}
    </div>
  );
}
