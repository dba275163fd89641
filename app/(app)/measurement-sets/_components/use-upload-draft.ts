"use client";

import { useMemo, useReducer } from "react";
import { type SignsFrom, uploadMeasurementMetaSchema } from "@/lib/contracts/measurement-sets";
import {
  type ColumnMapping,
  type FileDefaults,
  MAX_FILE_BYTES,
  parseMeasurementTable,
  proposeMapping,
  AUTO_FORMAT,
  readTable,
  type Table,
  type TableFormat,
} from "@/lib/measurements/parse";
import { formatBytes } from "./format";
import { zodIssueFields } from "@/lib/contracts/validation";

/*
 * The upload draft: the chosen file, its column mapping, the values typed once for the whole file
 * and the set's name, sample and lab, with what the parser and the upload schema say of them.
 * Nothing leaves the browser until the panel submits a valid draft.
 */

export interface LoadedFile {
  file: File;
  text: string;
  table: Table;
}

/** The values typed for columns the file does not have, as typed. */
export interface DefaultDrafts {
  relativeSigmaPercent: string;
  temperatureK: string;
  fieldT: string;
  lengthM: string;
}

export type DefaultErrors = Partial<Record<keyof DefaultDrafts, string>>;

const EMPTY_DEFAULTS: DefaultDrafts = { relativeSigmaPercent: "", temperatureK: "", fieldT: "", lengthM: "" };

interface DraftState {
  loaded: LoadedFile | null;
  fileError: string | null;
  mapping: ColumnMapping | null;
  /** How the file is read: detected ("auto") unless the user chose otherwise. */
  format: TableFormat;
  drafts: DefaultDrafts;
  labId: string;
  name: string;
  sample: string;
  /** The user tried to store: the name and sample errors show from then on. */
  tried: boolean;
  /** The parameter set whose model the signs are checked against; "" for no check. */
  signCheckSetId: string;
  /** "These are magnitudes": the set version whose model gives the signs; null keeps the file's signs. */
  modelSign: SignsFrom | null;
}

type DraftAction =
  | { type: "fileChosen" }
  | { type: "fileRejected"; message: string }
  | { type: "fileLoaded"; loaded: LoadedFile; proposedName: string | null }
  | { type: "mapping"; patch: Partial<ColumnMapping> }
  | { type: "format"; patch: Partial<TableFormat> }
  | { type: "default"; key: keyof DefaultDrafts; value: string }
  | { type: "text"; key: "labId" | "name" | "sample"; value: string }
  | { type: "signCheckSet"; id: string }
  | { type: "modelSign"; value: SignsFrom | null }
  | { type: "tried" };

function reduce(state: DraftState, action: DraftAction): DraftState {
  switch (action.type) {
    case "fileChosen":
      return { ...state, tried: false };
    case "fileRejected":
      return { ...state, fileError: action.message };
    case "fileLoaded":
      return {
        ...state,
        fileError: null,
        loaded: action.loaded,
        format: AUTO_FORMAT,
        mapping: proposeMapping(action.loaded.table.headers),
        drafts: EMPTY_DEFAULTS,
        name: action.proposedName ?? state.name,
        // Another file: its signs are its own until the person says otherwise again.
        modelSign: null,
      };
    case "format": {
      if (!state.loaded) return state;
      // Another delimiter gives other columns: the table is read again and the mapping proposed afresh.
      const format = { ...state.format, ...action.patch };
      const table = readTable(state.loaded.text, format);
      return { ...state, format, loaded: { ...state.loaded, table }, mapping: proposeMapping(table.headers) };
    }
    case "mapping":
      return { ...state, mapping: state.mapping ? { ...state.mapping, ...action.patch } : state.mapping };
    case "default":
      return { ...state, drafts: { ...state.drafts, [action.key]: action.value } };
    case "text":
      // Parameter sets belong to a lab: another lab drops the set checked against.
      if (action.key === "labId" && action.value !== state.labId)
        return { ...state, labId: action.value, signCheckSetId: "", modelSign: null };
      return { ...state, [action.key]: action.value };
    case "signCheckSet":
      return { ...state, signCheckSetId: action.id, modelSign: null };
    case "modelSign":
      return { ...state, modelSign: action.value };
    case "tried":
      return { ...state, tried: true };
  }
}

/** Empty text → not given; anything else must be a number (the parser and the server check ranges). */
function readDefaults(drafts: DefaultDrafts, mapping: ColumnMapping): { defaults: FileDefaults; errors: DefaultErrors } {
  const errors: DefaultErrors = {};
  const num = (key: keyof DefaultDrafts, used: boolean): number | undefined => {
    const text = drafts[key].trim();
    if (!used || text === "") return undefined;
    const value = Number(text);
    if (!Number.isFinite(value)) errors[key] = "Enter a number.";
    return Number.isFinite(value) ? value : undefined;
  };
  const percent = num("relativeSigmaPercent", mapping.sigmaColumn === null);
  const defaults: FileDefaults = {
    relativeSigma: percent === undefined ? undefined : percent / 100,
    temperatureK: num("temperatureK", mapping.temperatureColumn === null),
    fieldT: num("fieldT", mapping.fieldColumn === null),
    lengthM: num("lengthM", mapping.lengthColumn === null),
  };
  return { defaults: Object.fromEntries(Object.entries(defaults).filter(([, v]) => v !== undefined)) as FileDefaults, errors };
}

/** The file as a table, or why it cannot be one (too large, not UTF-8, empty). */
async function readMeasurementFile(file: File): Promise<{ loaded: LoadedFile } | { error: string }> {
  if (file.size > MAX_FILE_BYTES) {
    return { error: `“${file.name}” is ${formatBytes(file.size)}; a measurement file may be at most ${formatBytes(MAX_FILE_BYTES)}.` };
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(await file.arrayBuffer());
  } catch {
    return { error: `“${file.name}” is not UTF-8 text. Save it as CSV or TSV in UTF-8 and choose it again.` };
  }
  const table = readTable(text);
  if (table.headerLine === 0) return { error: `“${file.name}” is empty: it needs a header line and data rows.` };
  return { loaded: { file, text, table } };
}

const baseName = (fileName: string) =>
  fileName
    .replace(/\.[^.]+$/, "")
    .replace(/[_-]+/g, " ")
    .trim();

export function useUploadDraft(defaultLabId: string) {
  const [state, dispatch] = useReducer(reduce, {
    loaded: null,
    fileError: null,
    mapping: null,
    format: AUTO_FORMAT,
    drafts: EMPTY_DEFAULTS,
    labId: defaultLabId,
    name: "",
    sample: "",
    tried: false,
    signCheckSetId: "",
    modelSign: null,
  });
  const { loaded, mapping, format, drafts, labId, name, sample } = state;

  const checked = useMemo(() => {
    if (!loaded || !mapping) return null;
    const { defaults, errors } = readDefaults(drafts, mapping);
    return { defaults, fieldErrors: errors, result: parseMeasurementTable(loaded.text, mapping, defaults, format) };
  }, [loaded, mapping, drafts, format]);

  const meta = useMemo(
    () =>
      mapping && checked
        ? uploadMeasurementMetaSchema.safeParse({ labId, name, sample, mapping, defaults: checked.defaults, format })
        : null,
    [labId, name, sample, mapping, checked, format],
  );
  const metaErrors: Record<string, string> = meta && !meta.success ? zodIssueFields(meta.error.issues) : {};

  /** A new file replaces the table and the mapping; the name is proposed from the file's while it is empty. */
  async function chooseFile(file: File) {
    dispatch({ type: "fileChosen" });
    const read = await readMeasurementFile(file);
    if ("error" in read) {
      dispatch({ type: "fileRejected", message: read.error });
      return;
    }
    dispatch({ type: "fileLoaded", loaded: read.loaded, proposedName: name.trim() === "" ? baseName(file.name) : null });
  }

  /**
   * Marks the draft as tried; returns what to upload when every row and field is valid. `signsFrom`
   * is the model sign still in force (the sign check drops it when the set was saved again since).
   */
  function trySubmit(signsFrom: SignsFrom | null) {
    dispatch({ type: "tried" });
    if (!loaded || !checked || !meta?.success || checked.result.errors.length > 0 || Object.keys(checked.fieldErrors).length > 0)
      return null;
    return { file: loaded.file, meta: signsFrom ? { ...meta.data, signsFrom } : meta.data };
  }

  return {
    ...state,
    checked,
    metaErrors,
    chooseFile,
    trySubmit,
    patchMapping: (patch: Partial<ColumnMapping>) => dispatch({ type: "mapping", patch }),
    patchFormat: (patch: Partial<TableFormat>) => dispatch({ type: "format", patch }),
    setDefault: (key: keyof DefaultDrafts, value: string) => dispatch({ type: "default", key, value }),
    setText: (key: "labId" | "name" | "sample", value: string) => dispatch({ type: "text", key, value }),
    chooseSignCheckSet: (id: string) => dispatch({ type: "signCheckSet", id }),
    setModelSign: (value: SignsFrom | null) => dispatch({ type: "modelSign", value }),
  };
}
