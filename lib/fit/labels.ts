import { PARAM_META } from "@/lib/model/param-meta";
import { setOfScaleName } from "./problem";

/*
 * A fitted parameter's name in words, wherever a fit is shown (the panel's report, the version
 * history, the printed report): a model key's label, or the field × length scale factor of a
 * measurement set.
 */

const META = new Map(PARAM_META.map((m) => [m.key as string, m]));

export function fitNameLabel(name: string): string {
  const set = setOfScaleName(name);
  return set !== null ? `Field × length scale of “${set}”` : (META.get(name)?.label ?? name);
}

export function fitNameUnit(name: string): string {
  return META.get(name)?.unit ?? "";
}
