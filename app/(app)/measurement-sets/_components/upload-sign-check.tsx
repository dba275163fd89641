"use client";

import { useEffect, useRef } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/select-field";
import type { SignsFrom } from "@/lib/contracts/measurement-sets";
import { describeError } from "@/lib/query/fetcher";
import { countOf, noun } from "@/lib/text/plural";
import { fmt } from "@/lib/workbench/format";
import type { SignCheckView, useSignCheck } from "./use-sign-check";

type SignCheck = ReturnType<typeof useSignCheck>;

const VALUE = noun("value");
const TAKE_LABEL = "These are magnitudes: store them with the model's sign";

/**
 * The sign check of the upload: the person picks the material's parameter set (none by default:
 * a check against another material's set would warn for nothing); when every value has the sign
 * opposite to the model's, the panel says so and offers to store the magnitudes with the model's
 * sign, which one more click takes back.
 */
export function UploadSignCheck({
  id,
  check,
  setId,
  modelSign,
  unit,
  rowsValid,
  onChooseSet,
  onModelSign,
}: {
  id: string;
  check: SignCheck;
  setId: string;
  modelSign: SignsFrom | null;
  unit: string;
  rowsValid: boolean;
  onChooseSet: (id: string) => void;
  onModelSign: (value: SignsFrom | null) => void;
}) {
  const { sets, set, view, signsFrom, stale } = check;
  // The action and its undo replace each other; keyboard focus follows to whichever is shown.
  const boxRef = useRef<HTMLFieldSetElement>(null);
  const moveFocus = useRef(false);
  useEffect(() => {
    if (!moveFocus.current) return;
    moveFocus.current = false;
    boxRef.current?.querySelector<HTMLButtonElement>("button[data-sign-action]")?.focus();
  }, [modelSign]);
  const toggle = (value: SignsFrom | null) => {
    moveFocus.current = true;
    onModelSign(value);
  };

  const take = set.data ? () => toggle({ parameterSetId: set.data.id, version: set.data.version }) : undefined;
  const setName = set.data ? `“${set.data.name}” (version ${set.data.version})` : "";

  return (
    <fieldset ref={boxRef} className="space-y-3 rounded-md border border-ink/10 p-3" data-testid="sign-check">
      <legend className="px-1 text-sm font-semibold">Sign check</legend>
      <SelectField
        id={`${id}-sign-set`}
        label="Check the signs against"
        value={setId}
        onChange={(event) => onChooseSet(event.target.value)}
        disabled={sets.isPending}
        hint={
          "Optional. Compares each value's sign with the model's prediction for the material at the value's own wavelength, " +
          "temperature, field and length; no check until you choose the material's parameter set."
        }
      >
        <option value="">{sets.isPending ? "Loading the lab's parameter sets…" : "No check"}</option>
        {(sets.data ?? []).map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </SelectField>
      {sets.data?.length === 0 ? <p className="text-sm text-ink-soft">This lab has no parameter sets to check against yet.</p> : null}
      {sets.isError ? (
        <p role="alert" className="text-sm text-ember">
          The lab&apos;s parameter sets could not be loaded: {describeError(sets.error)}
        </p>
      ) : null}

      {setId === "" ? null : set.isError ? (
        <p role="alert" className="text-sm text-ember">
          The parameter set could not be loaded: {describeError(set.error)}
        </p>
      ) : !set.data ? (
        <p role="status" className="text-sm text-ink-soft">
          Loading the parameter set…
        </p>
      ) : !rowsValid || !view ? (
        <p role="status" className="text-sm text-ink-soft">
          The check runs once every row is valid.
        </p>
      ) : signsFrom ? (
        <Alert tone="info" title={`Stored with the model's sign of ${setName}`}>
          <p>
            The file&apos;s values are taken as magnitudes:{" "}
            {view.changes === view.result.total
              ? `all ${countOf(view.changes, VALUE)}`
              : `${countOf(view.changes, VALUE)} of ${view.result.total}`}{" "}
            will be stored with the sign this model predicts at their own conditions
            {view.example ? ` (line ${view.example.line}: ${fmt(view.example.from, 6)} → ${fmt(view.example.to, 6)} ${unit})` : ""}. The
            file itself is kept as uploaded, and the set will say that its signs came from this parameter set.
          </p>
          <Button variant="secondary" className="mt-2" data-sign-action onClick={() => toggle(null)}>
            Keep the file&apos;s signs
          </Button>
        </Alert>
      ) : (
        <SignFindings view={view} setName={setName} stale={stale} onTake={take} />
      )}
    </fieldset>
  );
}

function SignFindings({
  view,
  setName,
  stale,
  onTake,
}: {
  view: SignCheckView;
  setName: string;
  stale: boolean;
  onTake: (() => void) | undefined;
}) {
  const { result } = view;
  const uncompared = result.total - result.compared;
  const left =
    uncompared > 0
      ? ` ${countOf(uncompared, VALUE)} cannot be compared (a zero value, or no model sign: zero field, or a Verdet constant at 0 T)` +
        " and stay as they are."
      : "";
  const staleNote = stale ? " The parameter set was saved again since you took its sign; check again." : "";
  const action = (
    <Button variant={result.allOpposite ? "primary" : "secondary"} className="mt-2" data-sign-action onClick={onTake}>
      {TAKE_LABEL}
    </Button>
  );

  if (result.allOpposite)
    return (
      <Alert tone="warning" title={`Every value has the sign opposite to what the model predicts for ${setName}.`}>
        <p>
          {result.compared === 1 ? "The value" : `All ${result.compared} values`} compared {result.compared === 1 ? "has" : "have"} one sign
          and this model predicts the other at their own conditions. Vendor sheets often quote |V|, the magnitude only; if this file does,
          store the values with the model&apos;s sign.{left}
          {staleNote}
        </p>
        {action}
      </Alert>
    );
  if (result.opposite > 0)
    return (
      <Alert tone="info" title={`${countOf(result.opposite, VALUE)} of ${result.compared} with the sign opposite to the model's`}>
        <p>
          At their own conditions, the model for {setName} predicts the other sign for {countOf(result.opposite, VALUE)}.
          {result.oneSign
            ? " Every value in the file has one sign, as a file of magnitudes has when the model's sign changes across its range."
            : " Check those rows (a sign lost in the file, or a material this set does not describe) before a fit."}
          {left}
          {staleNote}
        </p>
        {result.oneSign ? action : null}
      </Alert>
    );
  return (
    <Alert tone="success">
      {result.compared === 0
        ? `No value can be compared with the model for ${setName}.${left}`
        : `Every value compared has the sign the model predicts for ${setName}.${left}`}
      {staleNote}
    </Alert>
  );
}
