"use client";

import { useRouter } from "next/navigation";
import { useId, useMemo, useState, type FormEvent } from "react";
import { CautionsPanel } from "@/components/planner/cautions-panel";
import { LightSourcesPanel } from "@/components/planner/light-sources-panel";
import { PlanResults } from "@/components/planner/plan-results";
import { RotatorPanel } from "@/components/planner/rotator-panel";
import { SavedPlans } from "@/components/planner/saved-plans";
import { usePlanRun } from "@/components/planner/use-plan-run";
import { Button, LinkButton } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { zodIssueLines } from "@/lib/contracts/validation";
import { cautionsFor } from "@/lib/planner/cautions";
import { type PlanRequest, planRequestSchema, rangeValues } from "@/lib/planner/schema";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import { useParameterSet, useParameterSets } from "@/lib/query/parameter-sets";
import { useLightSources, usePlans } from "@/lib/query/planner";
import { ModelLimits } from "@/components/workbench/model-limits";
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

interface Drafts {
  tMin: string;
  tMax: string;
  tStep: string;
  bMin: string;
  bMax: string;
  bStep: string;
  lengthMm: string;
  noiseKind: "density" | "sigma";
  densityUrad: string;
  integrationS: string;
  sigmaUrad: string;
  points: string;
  criterion: "share" | "magneticScale" | "dOptimal";
  shareNm: string;
}

const FIELD_LABEL: Record<string, string> = {
  lines: "Lines",
  minK: "Lowest temperature",
  maxK: "Highest temperature",
  stepK: "Temperature step",
  minT: "Lowest field",
  maxT: "Highest field",
  stepT: "Field step",
  fields: "Fields",
  lengthM: "Sample length",
  radPerSqrtHz: "Noise",
  integrationS: "Integration time",
  sigmaRad: "σ per point",
  points: "Points",
  criterion: "Quantity",
  wavelengthNm: "Wavelength",
  freeKeys: "Free parameters",
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
  const [unchecked, setUnchecked] = useState<Set<string>>(new Set());
  const [typed, setTyped] = useState<{ name: string; wavelengthNm: number }[]>([]);
  const [typedDraft, setTypedDraft] = useState("");
  const [typedError, setTypedError] = useState<string | null>(null);
  const [drafts, setDrafts] = useState<Drafts>(() => ({
    tMin: String(Math.max(10, Math.ceil(params.curieWeissK + 1))),
    tMax: "300",
    tStep: "10",
    bMin: "0.5",
    bMax: "2",
    bStep: "0.5",
    lengthMm: String(Number((params.lengthM * 1000).toPrecision(6))),
    noiseKind: "density",
    densityUrad: "1",
    integrationS: "1",
    sigmaUrad: "1",
    points: "4",
    criterion: "share",
    shareNm: "1064",
  }));
  const [ranRequest, setRanRequest] = useState<PlanRequest | null>(null);
  const [issues, setIssues] = useState<string[]>([]);

  const labLines = useMemo(() => sources.data ?? [], [sources.data]);
  const chosenLines = useMemo(
    () => [...labLines.filter((l) => !unchecked.has(l.id)).map((l) => ({ name: l.name, wavelengthNm: l.wavelengthNm })), ...typed],
    [labLines, unchecked, typed],
  );

  const setDraft = (key: keyof Drafts) => (value: string) => setDrafts((d) => ({ ...d, [key]: value }));
  const input = (key: keyof Drafts, label: string, unit: string) => (
    <label className="grid gap-1 text-sm" htmlFor={`${base}-${key}`}>
      <span>
        {label} <span className="text-ink-soft">({unit})</span>
      </span>
      <input
        id={`${base}-${key}`}
        inputMode="decimal"
        className={INPUT_CLASS}
        value={drafts[key]}
        onChange={(e) => setDraft(key)(e.target.value)}
      />
    </label>
  );

  const buildRequest = () =>
    planRequestSchema.safeParse({
      params,
      lines: chosenLines,
      temperatures: { minK: num(drafts.tMin), maxK: num(drafts.tMax), stepK: num(drafts.tStep) },
      fields: { minT: num(drafts.bMin), maxT: num(drafts.bMax), stepT: num(drafts.bStep) },
      lengthM: num(drafts.lengthMm) / 1000,
      noise:
        drafts.noiseKind === "density"
          ? { kind: "density", radPerSqrtHz: num(drafts.densityUrad) * 1e-6, integrationS: num(drafts.integrationS) }
          : { kind: "sigma", sigmaRad: num(drafts.sigmaUrad) * 1e-6 },
      points: num(drafts.points),
      criterion: drafts.criterion === "share" ? { kind: "share", wavelengthNm: num(drafts.shareNm) } : { kind: drafts.criterion },
    });

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = buildRequest();
    if (!parsed.success) {
      setIssues(zodIssueLines(parsed.error.issues, { rootLabel: "Request", label: planFieldLabel }));
      return;
    }
    setIssues([]);
    setRanRequest(parsed.data);
    void run(parsed.data);
  };

  const addTyped = () => {
    const [namePart, nmPart] = typedDraft.includes("@") ? typedDraft.split("@") : [`typed ${typedDraft.trim()} nm`, typedDraft];
    const nm = parseNumber((nmPart ?? "").trim());
    if (nm === null || nm <= 0) return setTypedError("Type a wavelength in nm (e.g. 780), or name@wavelength (e.g. probe@780).");
    setTypedError(null);
    setTyped((t) => [...t, { name: (namePart ?? "").trim() || `typed ${nm} nm`, wavelengthNm: nm }]);
    setTypedDraft("");
  };

  const temps = (() => {
    const a = num(drafts.tMin);
    return Number.isFinite(a) ? a : null;
  })();
  const bMax = Math.max(Math.abs(num(drafts.bMin)) || 0, Math.abs(num(drafts.bMax)) || 0);
  const cautions = cautionsFor({
    lines: [
      ...labLines.filter((l) => !unchecked.has(l.id)).map((l) => ({ name: l.name, wavelengthNm: l.wavelengthNm, powerW: l.powerW })),
      ...typed.map((t) => ({ ...t, powerW: null })),
    ],
    minTemperatureK: temps,
    maxFieldT: bMax > 0 ? bMax : null,
  });
  const candidateCount = (() => {
    try {
      return (
        chosenLines.length *
        rangeValues(num(drafts.tMin), num(drafts.tMax), num(drafts.tStep)).length *
        rangeValues(num(drafts.bMin), num(drafts.bMax), num(drafts.bStep)).filter((b) => b !== 0).length
      );
    } catch {
      return null;
    }
  })();

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
        <h2 className="text-lg font-semibold">Plan measurements</h2>
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
                    setUnchecked((u) => {
                      const next = new Set(u);
                      if (e.target.checked) next.delete(l.id);
                      else next.add(l.id);
                      return next;
                    })
                  }
                />
                {l.name} ({l.wavelengthNm} nm)
              </label>
            ))}
            {typed.map((t, i) => (
              <span key={`${t.name}-${i}`} className="flex items-center gap-1">
                {t.name} ({t.wavelengthNm} nm)
                <Button variant="quiet" aria-label={`Remove ${t.name}`} onClick={() => setTyped((all) => all.filter((_, j) => j !== i))}>
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
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
          {input("tMin", "Lowest temperature", "K")}
          {input("tMax", "Highest temperature", "K")}
          {input("tStep", "Temperature step", "K")}
          {input("bMin", "Lowest field", "T")}
          {input("bMax", "Highest field", "T")}
          {input("bStep", "Field step", "T")}
        </div>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
          {input("lengthMm", "Sample length", "mm")}
          <label className="grid gap-1 text-sm" htmlFor={`${base}-noiseKind`}>
            Noise given as
            <select
              id={`${base}-noiseKind`}
              className={INPUT_CLASS}
              value={drafts.noiseKind}
              onChange={(e) => setDraft("noiseKind")(e.target.value)}
            >
              <option value="density">noise density and time</option>
              <option value="sigma">σ per point</option>
            </select>
          </label>
          {drafts.noiseKind === "density" ? (
            <>
              {input("densityUrad", "Rotation noise", "µrad/√Hz")}
              {input("integrationS", "Integration per point", "s")}
            </>
          ) : (
            input("sigmaUrad", "σ per point", "µrad")
          )}
          {input("points", "Points you can afford", "count")}
        </div>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          <label className="grid gap-1 text-sm" htmlFor={`${base}-criterion`}>
            Quantity to pin down
            <select
              id={`${base}-criterion`}
              className={INPUT_CLASS}
              value={drafts.criterion}
              onChange={(e) => setDraft("criterion")(e.target.value)}
            >
              <option value="share">σ of the magnetic share at a wavelength</option>
              <option value="magneticScale">σ of magneticScale</option>
              <option value="dOptimal">D-optimal (all free parameters)</option>
            </select>
          </label>
          {drafts.criterion === "share" ? input("shareNm", "Share at wavelength", "nm") : null}
          <p className="self-end text-xs text-ink-soft">
            Free parameters: gyrationPerT (electric-dipole part) and magneticScale (magnetic-dipole part).{" "}
            {candidateCount !== null && Number.isFinite(candidateCount) ? `${candidateCount} candidate points.` : ""}
          </p>
        </div>
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

      {state.status === "done" && ranRequest ? (
        <PlanResults result={state.result} request={ranRequest} elapsedMs={state.elapsedMs} set={set} canSave={canEdit} />
      ) : null}
      {state.status === "idle" ? <p className="text-sm text-ink-soft">Run the planner to see ranked plans.</p> : null}

      <CautionsPanel cautions={cautions} />
      <SavedPlans setId={set.id} plans={plans.data ?? null} loading={plans.isPending} canEdit={canEdit} />
      <RotatorPanel params={params} />
    </div>
  );
}
