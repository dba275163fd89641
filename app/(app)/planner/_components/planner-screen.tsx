"use client";

import { useRouter } from "next/navigation";
import { useEffect, useId, useMemo, useState, type FormEvent } from "react";
import { CautionsPanel } from "@/components/planner/cautions-panel";
import { LightSourcesPanel } from "@/components/planner/light-sources-panel";
import { PlanResults } from "@/components/planner/plan-results";
import { RotatorPanel } from "@/components/planner/rotator-panel";
import { SavedPlans } from "@/components/planner/saved-plans";
import { usePlanRun } from "@/components/planner/use-plan-run";
import { usePlannerDraft } from "@/components/planner/use-planner-draft";
import { Button, LinkButton } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { zodIssueLines } from "@/lib/contracts/validation";
import { cautionsFor } from "@/lib/planner/cautions";
import { FREEABLE_KEYS, type FreeableKey } from "@/lib/analysis/definition";
import { type PlannerDrafts, defaultPlannerDrafts, planRequestFromDrafts } from "@/lib/planner/form";
import type { PlanResult } from "@/lib/planner/plan";
import { type PlanRequest, planRequestSchema, rangeValues } from "@/lib/planner/schema";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import { useParameterSet, useParameterSets } from "@/lib/query/parameter-sets";
import { useLightSources, usePlans } from "@/lib/query/planner";
import { ModelLimits } from "@/components/workbench/model-limits";
import { fmt } from "@/lib/workbench/format";
import { parseNumber } from "@/lib/workbench/validate";

/** /planner: choose a parameter set, then plan measurements and size a rotator for it. */
export function PlannerScreen({ setId }: { setId: string | null }) {
  const router = useRouter();
  const sets = useParameterSets({});
  const id = useId();
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <PageHeader
        title="Planner"
        lead={
          "Which lines, temperatures and fields tell the electric-dipole and magnetic-dipole parts apart, " +
          "and how well; and how long a rotator must be."
        }
      />
      <label className="grid max-w-xl gap-1 text-sm" htmlFor={`${id}-set`}>
        Parameter set
        <select
          id={`${id}-set`}
          className={INPUT_CLASS}
          value={setId ?? ""}
          onChange={(e) => router.replace(e.target.value ? `/planner?setId=${encodeURIComponent(e.target.value)}` : "/planner")}
        >
          <option value="">Choose a parameter set…</option>
          {(sets.data ?? []).map((s) => (
            <option key={s.id} value={s.id}>
              {s.name} — {s.labName} (v{s.version})
            </option>
          ))}
        </select>
      </label>
      {sets.isPending ? <SkeletonRows rows={2} label="Loading parameter sets…" /> : null}
      {sets.isError ? <ErrorPanel error={sets.error} retry={() => void sets.refetch()} /> : null}
      {sets.data && sets.data.length === 0 ? (
        <p className="text-sm text-ink-soft">No parameter sets yet: create one first, then plan for it.</p>
      ) : null}
      {setId ? <PlannerForSet key={setId} setId={setId} /> : null}
    </div>
  );
}

function PlannerForSet({ setId }: { setId: string }) {
  const query = useParameterSet(setId);
  const item = query.data;
  if (query.isPending) return <SkeletonRows rows={6} label="Loading the parameter set…" />;
  if (query.isError) return <ErrorPanel error={query.error} retry={() => void query.refetch()} />;
  if (!item) return null;
  const parsed = modelParamsSchema.safeParse(item.params);
  if (!parsed.success) return <p role="alert">This set&apos;s stored parameters are not valid, so it cannot be planned for.</p>;
  const canEdit = item.role === "owner" || item.role === "editor";
  return (
    <PlannerBody
      set={{ id: item.id, name: item.name, version: item.version, labId: item.labId, labName: item.labName }}
      params={parsed.data}
      canEdit={canEdit}
    />
  );
}

const FIELD_LABEL: Record<string, string> = {
  lines: "Lines",
  minK: "Lowest temperature",
  maxK: "Highest temperature",
  stepK: "Temperature step",
  valuesK: "Temperatures",
  minT: "Lowest field",
  maxT: "Highest field",
  stepT: "Field step",
  fields: "Fields",
  lengthM: "Sample length",
  radPerSqrtHz: "Noise",
  integrationS: "Integration time",
  sigmaRad: "σ per point",
  relativeFloor: "Relative floor",
  minTransmission: "Minimum transmission",
  referencePowerW: "Reference power",
  points: "Points",
  criterion: "Quantity",
  alternative: "Alternative magneticScale",
  wavelengthNm: "Wavelength",
  free: "Free parameters",
  key: "Free parameters",
  scaleSigma: "Field × length calibration",
  temperatureSigmaK: "Temperature calibration",
  samples: "Samples",
  ranges: "Prior ranges",
  perPointS: "Time per point",
  perCooldownS: "Time per cool-down",
};

/** An issue's field as the form names it: the last key of its path (list positions skipped), else "Request". */
const planFieldLabel = (path: string) =>
  FIELD_LABEL[
    path
      .split(".")
      .filter((key) => !/^\d+$/.test(key))
      .at(-1) ?? ""
  ] ?? "Request";

const num = (s: string) => parseNumber(s) ?? Number.NaN;

/** What the planner keeps in the tab for this set: the inputs as typed and the last run. */
interface PlannerDraft {
  drafts: PlannerDrafts;
  unchecked: string[];
  typed: { name: string; wavelengthNm: number }[];
  last: { result: PlanResult; request: PlanRequest; elapsedMs: number } | null;
}

type TextDraftKey = { [K in keyof PlannerDrafts]: PlannerDrafts[K] extends string ? K : never }[keyof PlannerDrafts];

function PlannerBody({
  set,
  params,
  canEdit,
}: {
  set: { id: string; name: string; version: number; labId: string; labName: string };
  params: ModelParams;
  canEdit: boolean;
}) {
  const base = useId();
  const sources = useLightSources(set.labId);
  const plans = usePlans(set.id);
  const { state, run, cancel } = usePlanRun();
  const [draft, setDraft] = usePlannerDraft<PlannerDraft>(set.id, () => ({
    drafts: defaultPlannerDrafts(params),
    unchecked: [],
    typed: [],
    last: null,
  }));
  const { drafts, typed } = draft;
  const unchecked = useMemo(() => new Set(draft.unchecked), [draft.unchecked]);
  const [typedDraft, setTypedDraft] = useState("");
  const [typedError, setTypedError] = useState<string | null>(null);
  const [pendingRequest, setPendingRequest] = useState<PlanRequest | null>(null);
  const [issues, setIssues] = useState<string[]>([]);

  const labLines = useMemo(() => sources.data ?? [], [sources.data]);
  const chosenLines = useMemo(
    () => [
      ...labLines
        .filter((l) => !unchecked.has(l.id))
        .map((l) => ({ name: l.name, wavelengthNm: l.wavelengthNm, powerW: l.powerW ?? null })),
      ...typed,
    ],
    [labLines, unchecked, typed],
  );

  // A finished run becomes the remembered last result.
  useEffect(() => {
    if (state.status === "done" && pendingRequest) {
      const { result, elapsedMs } = state;
      setDraft((d) => ({ ...d, last: { result, request: pendingRequest, elapsedMs } }));
      setPendingRequest(null);
    }
  }, [state, pendingRequest, setDraft]);

  const setField =
    <K extends keyof PlannerDrafts>(key: K) =>
    (value: PlannerDrafts[K]) =>
      setDraft((d) => ({ ...d, drafts: { ...d.drafts, [key]: value } }));
  const input = (key: TextDraftKey, label: string, unit: string) => (
    <label className="grid gap-1 text-sm" htmlFor={`${base}-${key}`}>
      <span>
        {label} {unit ? <span className="text-ink-soft">({unit})</span> : null}
      </span>
      <input
        id={`${base}-${key}`}
        inputMode={key === "priors" || key === "robustRanges" || key === "tSet" ? "text" : "decimal"}
        className={INPUT_CLASS}
        value={drafts[key]}
        onChange={(e) => setField(key)(e.target.value)}
      />
    </label>
  );
  const select = <K extends keyof PlannerDrafts>(key: K, label: string, options: [PlannerDrafts[K] & string, string][]) => (
    <label className="grid gap-1 text-sm" htmlFor={`${base}-${key}`}>
      {label}
      <select
        id={`${base}-${key}`}
        className={INPUT_CLASS}
        value={drafts[key] as string}
        onChange={(e) => setField(key)(e.target.value as PlannerDrafts[K])}
      >
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const built = planRequestFromDrafts(drafts, params, chosenLines);
    if (!built.ok) {
      setIssues(built.issues);
      return;
    }
    const parsed = planRequestSchema.safeParse(built.input);
    if (!parsed.success) {
      setIssues(zodIssueLines(parsed.error.issues, { rootLabel: "Request", label: planFieldLabel }));
      return;
    }
    setIssues([]);
    setPendingRequest(parsed.data);
    void run(parsed.data);
  };

  const addTyped = () => {
    const [namePart, nmPart] = typedDraft.includes("@") ? typedDraft.split("@") : [`typed ${typedDraft.trim()} nm`, typedDraft];
    const nm = parseNumber((nmPart ?? "").trim());
    if (nm === null || nm <= 0) return setTypedError("Type a wavelength in nm (e.g. 780), or name@wavelength (e.g. probe@780).");
    setTypedError(null);
    setDraft((d) => ({ ...d, typed: [...d.typed, { name: (namePart ?? "").trim() || `typed ${nm} nm`, wavelengthNm: nm }] }));
    setTypedDraft("");
  };

  const temperatureList = drafts.tMode === "set" ? drafts.tSet.split(/[,;]/).map(num).filter(Number.isFinite) : [];
  const lowestK = drafts.tMode === "set" ? (temperatureList.length > 0 ? Math.min(...temperatureList) : null) : num(drafts.tMin);
  const bMax = Math.max(Math.abs(num(drafts.bMin)) || 0, Math.abs(num(drafts.bMax)) || 0);
  const cautions = cautionsFor({
    lines: [
      ...labLines.filter((l) => !unchecked.has(l.id)).map((l) => ({ name: l.name, wavelengthNm: l.wavelengthNm, powerW: l.powerW })),
      ...typed.map((t) => ({ ...t, powerW: null })),
    ],
    minTemperatureK: lowestK !== null && Number.isFinite(lowestK) ? lowestK : null,
    maxFieldT: bMax > 0 ? bMax : null,
  });
  const candidateCount = (() => {
    try {
      const temps =
        drafts.tMode === "set" ? temperatureList.length : rangeValues(num(drafts.tMin), num(drafts.tMax), num(drafts.tStep)).length;
      return chosenLines.length * temps * rangeValues(num(drafts.bMin), num(drafts.bMax), num(drafts.bStep)).filter((b) => b !== 0).length;
    } catch {
      return null;
    }
  })();
  const toggleFree = (key: FreeableKey, on: boolean) =>
    setField("free")(on ? [...drafts.free.filter((k) => k !== key), key] : drafts.free.filter((k) => k !== key));
  // The last finished run (also after a cancel or an error of a newer one, and after coming back to the page).
  const shown = state.status === "running" ? null : draft.last;

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <span>
          Planning for <strong>{set.name}</strong> (version {set.version}, {set.labName}).
        </span>
        <LinkButton variant="quiet" href={`/parameter-sets/${set.id}/report`}>
          Printable report
        </LinkButton>
        <LinkButton variant="quiet" href={`/workbench/${set.id}`}>
          Workbench
        </LinkButton>
      </div>
      <ModelLimits
        query={{
          params,
          temperaturesK: [num(drafts.tMin), num(drafts.tMax)].filter(Number.isFinite),
          fieldsT: [num(drafts.bMin), num(drafts.bMax)].filter(Number.isFinite),
          wavelengthsNm: chosenLines.map((l) => l.wavelengthNm),
        }}
        where="the planned grid"
      />
      {sources.isError ? <ErrorPanel error={sources.error} retry={() => void sources.refetch()} /> : null}
      {sources.data ? (
        <LightSourcesPanel labId={set.labId} labName={set.labName} sources={sources.data} canEdit={canEdit} />
      ) : (
        <SkeletonRows rows={2} label="Loading the lab's lines…" />
      )}

      <form onSubmit={submit} aria-label="Plan measurements" className="grid gap-4 rounded-lg border border-ink/15 bg-paper-raised p-4">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 className="text-lg font-semibold">Plan measurements</h2>
          <Button
            variant="quiet"
            onClick={() => setDraft((d) => ({ ...d, drafts: defaultPlannerDrafts(params), unchecked: [], typed: [] }))}
          >
            Reset inputs
          </Button>
        </div>
        <fieldset className="grid gap-2">
          <legend className="text-sm font-medium">Lines to choose from</legend>
          {labLines.length === 0 && typed.length === 0 ? (
            <p className="text-sm text-ink-soft">No lines: add the lab&apos;s lasers above, or type a wavelength here.</p>
          ) : null}
          <div className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
            {labLines.map((l) => (
              <label key={l.id} className="flex items-center gap-1.5">
                <input
                  type="checkbox"
                  checked={!unchecked.has(l.id)}
                  onChange={(e) =>
                    setDraft((d) => ({
                      ...d,
                      unchecked: e.target.checked ? d.unchecked.filter((x) => x !== l.id) : [...d.unchecked, l.id],
                    }))
                  }
                />
                {l.name} ({l.wavelengthNm} nm){l.powerW ? <span className="text-ink-soft"> · {fmt(l.powerW * 1000, 3)} mW</span> : null}
              </label>
            ))}
            {typed.map((t, i) => (
              <span key={`${t.name}-${i}`} className="flex items-center gap-1">
                {t.name} ({t.wavelengthNm} nm)
                <Button
                  variant="quiet"
                  aria-label={`Remove ${t.name}`}
                  onClick={() => setDraft((d) => ({ ...d, typed: d.typed.filter((_, j) => j !== i) }))}
                >
                  ×
                </Button>
              </span>
            ))}
          </div>
          <div className="flex flex-wrap items-end gap-2">
            <label className="grid gap-1 text-sm" htmlFor={`${base}-typed`}>
              Type a line (nm, or name@nm)
              <input
                id={`${base}-typed`}
                className={INPUT_CLASS}
                value={typedDraft}
                onChange={(e) => setTypedDraft(e.target.value)}
                onKeyDown={(e) => {
                  if (e.key === "Enter") {
                    e.preventDefault();
                    addTyped();
                  }
                }}
              />
            </label>
            <Button variant="secondary" onClick={addTyped}>
              Add line
            </Button>
          </div>
          {typedError ? (
            <p role="alert" className="text-sm text-ember">
              {typedError}
            </p>
          ) : null}
        </fieldset>
        <fieldset className="grid gap-2">
          <legend className="text-sm font-medium">Temperatures, field and sample</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            {select("tMode", "Temperatures given as", [
              ["set", "the lab's set (e.g. room, 77 K)"],
              ["range", "a range with a step"],
            ])}
            {drafts.tMode === "set" ? (
              input("tSet", "Available temperatures", "K, comma-separated")
            ) : (
              <>
                {input("tMin", "Lowest temperature", "K")}
                {input("tMax", "Highest temperature", "K")}
                {input("tStep", "Temperature step", "K")}
              </>
            )}
          </div>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            {input("bMin", "Lowest field", "T")}
            {input("bMax", "Magnet's largest field", "T")}
            {input("bStep", "Field step", "T")}
            {input("lengthMm", "Sample length", "mm")}
          </div>
        </fieldset>
        <fieldset className="grid gap-2">
          <legend className="text-sm font-medium">Noise of the laboratory</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            {select("noiseKind", "Polarimeter noise given as", [
              ["density", "noise density and time"],
              ["sigma", "σ per point"],
            ])}
            {drafts.noiseKind === "density" ? (
              <>
                {input("densityUrad", "Rotation noise at full transmission", "µrad/√Hz")}
                {input("integrationS", "Integration per point", "s")}
              </>
            ) : (
              input("sigmaUrad", "σ per point at full transmission", "µrad")
            )}
            {input("relativeFloorPct", "Relative floor", "% of θ")}
            {input("minTransmissionPct", "Minimum transmission", "%")}
            {input("referencePowerMw", "Noise stated at power (optional)", "mW")}
          </div>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={drafts.excludeWrapped} onChange={(e) => setField("excludeWrapped")(e.target.checked)} />
            Exclude points that rotate past π/2 (otherwise they are flagged: they need a field sweep to unwrap)
          </label>
          <p className="text-xs text-ink-soft">
            σ per point = polarimeter noise / √(transmission × power / reference power) ⊕ relative floor ⊕ the calibration below, propagated
            through the model. Points below the minimum transmission are never proposed.
          </p>
        </fieldset>
        <fieldset className="grid gap-2">
          <legend className="text-sm font-medium">The analysis (the fit&apos;s definition)</legend>
          <div className="flex flex-wrap gap-x-4 gap-y-1 text-sm" role="group" aria-label="Free parameters">
            {FREEABLE_KEYS.map((k) => (
              <label key={k} className="flex items-center gap-1.5">
                <input type="checkbox" checked={drafts.free.includes(k)} onChange={(e) => toggleFree(k, e.target.checked)} />
                {k}
              </label>
            ))}
          </div>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {input("priors", "Priors (KEY=MEAN:SIGMA, comma-separated)", "")}
            {input("scaleSigmaPct", "Field × length calibration σ", "%")}
            {input("temperatureSigmaK", "Temperature calibration σ", "K")}
          </div>
        </fieldset>
        <fieldset className="grid gap-2">
          <legend className="text-sm font-medium">What to plan for</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            {select("criterion", "Quantity", [
              ["detect", "detect the magnetic-dipole part"],
              ["share", "σ of the magnetic share at a wavelength"],
              ["magneticScale", "σ of magneticScale"],
              ["dOptimal", "D-optimal (all varied parameters)"],
            ])}
            {drafts.criterion === "share" ? input("shareNm", "Share at wavelength", "nm") : null}
            {drafts.criterion === "detect" ? input("alternative", "Alternative magneticScale (blank: prior or set)", "×") : null}
            {input("points", "Points you can afford", "count")}
            {select("robustMode", "Robust design", [
              ["off", "off: at the set's values"],
              ["average", "average over the prior ranges"],
              ["worst", "worst case over the prior ranges"],
            ])}
            {drafts.robustMode !== "off" ? (
              <>
                {input("robustRanges", "Prior ranges (KEY=MIN:MAX)", "")}
                {input("robustSamples", "Samples", "count")}
              </>
            ) : null}
          </div>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            {input("perPointS", "Time per point", "s")}
            {input("perCooldownH", "Time per cool-down", "h")}
          </div>
          <p className="text-xs text-ink-soft">
            {candidateCount !== null && Number.isFinite(candidateCount) ? `${candidateCount} candidate points.` : ""}
          </p>
        </fieldset>
        {issues.length > 0 ? (
          <ul
            role="alert"
            aria-label="Problems with the request"
            className="list-disc rounded-md border border-ember bg-ember-light py-2 pr-3 pl-8 text-sm"
          >
            {issues.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        ) : null}
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" disabled={state.status === "running"}>
            Run planner
          </Button>
          {state.status === "running" ? (
            <>
              <progress className="w-48" max={1} value={state.progress} aria-label="Planner progress" />
              <span className="text-sm tabular-nums">{Math.round(state.progress * 100)} %</span>
              <Button variant="secondary" onClick={cancel}>
                Cancel
              </Button>
            </>
          ) : null}
          {state.status === "cancelled" ? (
            <span role="status" className="text-sm text-ink-soft">
              Cancelled; nothing changed.
            </span>
          ) : null}
          {state.status === "error" ? (
            <span role="alert" className="text-sm text-ember">
              {state.message}
            </span>
          ) : null}
        </div>
      </form>

      {shown ? <PlanResults result={shown.result} request={shown.request} elapsedMs={shown.elapsedMs} set={set} canSave={canEdit} /> : null}
      {state.status === "idle" && !draft.last ? <p className="text-sm text-ink-soft">Run the planner to see ranked plans.</p> : null}

      <CautionsPanel cautions={cautions} />
      <SavedPlans setId={set.id} plans={plans.data ?? null} loading={plans.isPending} canEdit={canEdit} />
      <RotatorPanel params={params} />
    </div>
  );
}
