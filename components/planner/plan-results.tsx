"use client";

import { useId, useMemo, useState } from "react";
import { LinePlot } from "@/components/plots/line-plot";
import { useElementWidth } from "@/components/plots/use-element-size";
import { downloadText } from "@/components/plots/export-image";
import { Button, LinkButton } from "@/components/ui/button";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { planToCsv } from "@/lib/planner/export";
import { markersQueryValue } from "@/lib/planner/markers-query";
import type { PlanResult, RankedPlan } from "@/lib/planner/plan";
import type { PlanRequest } from "@/lib/planner/schema";
import { costText, definitionText, detectionText, noiseText } from "@/lib/planner/summary";
import { useSavePlan } from "@/lib/query/planner";
import { fmt, fmtPercent } from "@/lib/workbench/format";

const sigmaText = (v: number, unit: string) => (Number.isFinite(v) ? `${fmt(v, 3)} ${unit}` : "∞ (cannot separate)");

/** Ranked plans, σ against the number of points, and the actions on the chosen plan. */
export function PlanResults({
  result,
  request,
  elapsedMs,
  set,
  canSave,
}: {
  result: PlanResult;
  request: PlanRequest;
  elapsedMs: number;
  set: { id: string; name: string; version: number };
  canSave: boolean;
}) {
  const base = useId();
  const [chosen, setChosen] = useState(0);
  const plan = result.plans[chosen] ?? result.plans[0];
  const [plotRef, width] = useElementWidth<HTMLDivElement>(640);
  const save = useSavePlan(set.id);
  const [name, setName] = useState(`Plan for ${set.name}`.slice(0, 120));
  const [saved, setSaved] = useState<string | null>(null);

  const sigmaSeries = useMemo(
    () => [
      {
        key: "sigma",
        label: "expected σ",
        color: "#0f6e6e",
        dash: undefined,
        width: 2,
        values: result.sigmaVsPoints.map((s) => (Number.isFinite(s.sigma) && s.sigma > 0 ? s.sigma : null)),
      },
    ],
    [result],
  );
  const plottable = sigmaSeries[0]!.values.filter((v) => v !== null).length;

  if (!plan) return <p className="text-sm text-ink-soft">The search found no plan.</p>;

  const onSave = () => {
    setSaved(null);
    save.mutate(
      {
        name: name.trim() || `Plan for ${set.name}`,
        setVersion: set.version,
        request,
        plan: {
          criterionLabel: result.criterionLabel,
          criterionUnit: result.criterionUnit,
          expectedSigma: Number.isFinite(plan.expectedSigma) ? plan.expectedSigma : null,
          method: result.method,
          candidateCount: result.candidateCount,
          sigmaPerPointRad: result.sigmaPerPointRad,
          partsCorrelation: plan.partsCorrelation,
          points: plan.points.map((p) => ({
            lineName: p.lineName,
            wavelengthNm: p.wavelengthNm,
            temperatureK: p.temperatureK,
            fieldT: p.fieldT,
            count: p.count,
            rotationRad: p.rotationRad,
            belowNoise: p.belowNoise,
            transmission: p.transmission,
            flags: p.flags,
          })),
          notes: result.notes,
          detection: plan.detection
            ? {
                alternative: plan.detection.alternative,
                deltaChi2Null: plan.detection.deltaChi2Null,
                significance: plan.detection.significance,
                repeatsFor3Sigma: plan.detection.repeatsFor3Sigma,
                repeatsFor5Sigma: plan.detection.repeatsFor5Sigma,
              }
            : null,
          costHours: plan.costHours,
          noise: result.noise,
        },
      },
      { onSuccess: (item) => setSaved(`Saved “${item.name}”.`) },
    );
  };

  const csv = () =>
    downloadText(
      planToCsv({ setName: set.name, setVersion: set.version, result, plan }),
      `plan-${set.name.replace(/[^\w-]+/g, "-").toLowerCase()}.csv`,
      "text/csv",
    );
  const workbenchHref = `/workbench/${set.id}?markers=${encodeURIComponent(markersQueryValue(plan.points.map((p) => p.wavelengthNm)))}`;

  return (
    <section aria-labelledby={`${base}-title`} className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <h2 id={`${base}-title`} className="text-lg font-semibold">
        Ranked plans
      </h2>
      <p className="text-sm text-ink-soft">
        {result.criterionLabel} {result.criterionUnit}. {result.candidateCount} candidate points,{" "}
        {result.method === "exhaustive" ? "searched exhaustively" : "greedy search with exchange"} (
        {result.designsEvaluated.toLocaleString("en")} designs, {fmt(elapsedMs / 1000, 3)} s).
      </p>
      <ul aria-label="What the plans assume" className="grid gap-0.5 text-sm">
        <li>{definitionText(request) ?? `Analysis: free ${result.freeKeys.join(", ")}.`}</li>
        <li>{noiseText(result.noise)}</li>
        {result.robust ? (
          <li>
            Ranked by the {result.robust.mode === "worst" ? "worst case" : "average"} over {result.robust.samples} seeded samples of the
            prior ranges; the best plan at the ranges&apos; ends:{" "}
            {result.robust.ends
              .map(
                (e) =>
                  `${e.key} = ${fmt(e.value, 4)}: σ ${sigmaText(e.expectedSigma, result.criterionUnit)}` +
                  (e.detectionSignificance !== null ? `, ${fmt(e.detectionSignificance, 3)}σ detection` : ""),
              )
              .join("; ")}
            .
          </li>
        ) : null}
      </ul>
      <div role="note" aria-label="What the model implies" className="rounded-md border border-lux/40 bg-lux-light/60 px-4 py-3 text-sm">
        <p className="font-semibold">What the model implies</p>
        <ul className="mt-1 list-disc space-y-1 pl-5">
          {result.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      </div>
      <fieldset className="grid grid-cols-[minmax(0,1fr)] gap-3">
        <legend className="sr-only">Choose a plan</legend>
        {result.plans.map((p, i) => (
          <PlanCard
            key={i}
            plan={p}
            unit={result.criterionUnit}
            checked={i === chosen}
            onChoose={() => setChosen(i)}
            name={`${base}-plan`}
          />
        ))}
      </fieldset>
      <div className="flex flex-wrap items-end gap-2">
        {canSave ? (
          <>
            <label className="grid gap-1 text-sm" htmlFor={`${base}-name`}>
              Plan name
              <input
                id={`${base}-name`}
                className={`${INPUT_CLASS} min-w-56`}
                value={name}
                maxLength={120}
                onChange={(e) => setName(e.target.value)}
              />
            </label>
            <Button onClick={onSave} disabled={save.isPending}>
              {save.isPending ? "Saving…" : "Save plan"}
            </Button>
          </>
        ) : (
          <p className="text-sm text-ink-soft">Viewers cannot save plans; export the CSV instead.</p>
        )}
        <Button variant="secondary" onClick={csv}>
          Export CSV
        </Button>
        <LinkButton variant="secondary" href={workbenchHref}>
          Open in workbench
        </LinkButton>
      </div>
      {saved ? (
        <p role="status" className="text-sm text-lux-dark">
          {saved}
        </p>
      ) : null}
      {save.isError ? (
        <p role="alert" className="text-sm text-ember">
          {save.error.message}
        </p>
      ) : null}
      <div ref={plotRef} className="min-w-0">
        {plottable >= 1 ? (
          <LinePlot
            title="Expected standard error against the number of points"
            width={width}
            height={260}
            series={{ xs: result.sigmaVsPoints.map((s) => s.points), curves: sigmaSeries, legend: false }}
            axes={{ x: { type: "linear", label: "number of points" }, y: { type: "log", label: `expected σ ${result.criterionUnit}` } }}
          />
        ) : (
          <p className="text-sm text-ink-soft">
            No number of points up to {request.points} separates the varied parameters, so there is no σ to plot.
          </p>
        )}
      </div>
    </section>
  );
}

function PlanCard({
  plan,
  unit,
  checked,
  onChoose,
  name,
}: {
  plan: RankedPlan;
  unit: string;
  checked: boolean;
  onChoose: () => void;
  name: string;
}) {
  const id = useId();
  return (
    <div
      className={`rounded-lg border p-3 ${checked ? "border-lux bg-paper-raised" : "border-ink/15 bg-paper-raised"}`}
      data-testid="ranked-plan"
    >
      <label htmlFor={id} className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <input id={id} type="radio" name={name} checked={checked} onChange={onChoose} />
        <span className="font-semibold">Plan {plan.rank}</span>
        <span className="tabular-nums">expected σ {sigmaText(plan.expectedSigma, unit)}</span>
        <span className="tabular-nums text-sm">{costText(plan.costHours)}</span>
        {plan.partsCorrelation !== null ? (
          <span className="text-sm text-ink-soft">correlation between the parts {fmt(plan.partsCorrelation, 3)}</span>
        ) : null}
      </label>
      {plan.detection ? <p className="mt-1 text-sm">{detectionText(plan.detection)}</p> : null}
      <div className="relative mt-2 overflow-x-auto">
        <table className="w-full min-w-[40rem] text-sm">
          <caption className="sr-only">Points of plan {plan.rank}</caption>
          <thead className="text-left text-ink-soft">
            <tr>
              <th scope="col" className="py-1 pr-2 font-medium">
                Line
              </th>
              <th scope="col" className="pr-2 font-medium">
                λ (nm)
              </th>
              <th scope="col" className="pr-2 font-medium">
                T (K)
              </th>
              <th scope="col" className="pr-2 font-medium">
                B (T)
              </th>
              <th scope="col" className="pr-2 font-medium">
                ×
              </th>
              <th scope="col" className="pr-2 font-medium">
                predicted θ (mrad)
              </th>
              <th scope="col" className="pr-2 font-medium">
                transmission
              </th>
              <th scope="col" className="pr-2 font-medium">
                σ (mrad)
              </th>
              <th scope="col" className="pr-2 font-medium">
                magnetic share
              </th>
              <th scope="col" className="font-medium">
                signal / noise, flags
              </th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {plan.points.map((p) => (
              <tr key={p.index} className="border-t border-ink/10">
                <td className="py-1 pr-2">{p.lineName}</td>
                <td className="pr-2">{p.wavelengthNm}</td>
                <td className="pr-2">{p.temperatureK}</td>
                <td className="pr-2">{p.fieldT}</td>
                <td className="pr-2">{p.count}</td>
                <td className="pr-2">{fmt(p.rotationRad * 1000, 4)}</td>
                <td className="pr-2">{fmtPercent(p.transmission)}</td>
                <td className="pr-2">{fmt(p.sigmaRad * 1000, 3)}</td>
                <td className="pr-2">{fmtPercent(Number.isFinite(p.magneticShare) ? p.magneticShare : null)}</td>
                <td>
                  {fmt(p.signalToNoise, 3)}
                  {p.belowNoise ? <span className="ml-2 rounded bg-ember-light px-1.5 text-ember">below noise</span> : null}
                  {p.flags.includes("phase-wrap") ? (
                    <span className="ml-2 rounded bg-ember-light px-1.5 text-ember" title="needs a field sweep to unwrap">
                      past π/2
                    </span>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
