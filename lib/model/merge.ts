import type { DiffFieldKey, SetSnapshot } from "./diff";
import { FLAG_META, PARAM_META } from "./param-meta";

/*
 * Field-by-field merge for an edit conflict. The user started from `base`; meanwhile someone saved
 * `theirs`. The result is `theirs` with only the fields this user changed (mine ≠ base) applied on
 * top, so a field the other person changed and this user never touched keeps the other person's
 * value. Where both changed the same field to different values, this user's value wins (they asked
 * to apply theirs over) and the field is listed as a clash, so the preview can point it out.
 */

export interface MergeInput<P extends SetSnapshot["params"]> {
  base: SetSnapshot & { params: P };
  mine: SetSnapshot & { params: P };
  theirs: SetSnapshot & { params: P };
}

export interface MergeResult<P> {
  merged: SetSnapshot & { params: P };
  /** Fields taken from this user's form. */
  mine: DiffFieldKey[];
  /** Fields both changed, to different values; this user's value is in `merged`. */
  clashes: DiffFieldKey[];
}

function tagsKey(tags: readonly string[]): string {
  return [...new Set(tags.map((t) => t.trim()).filter(Boolean))].sort((a, b) => a.localeCompare(b)).join("\u0000");
}

function sameNumber(a: number | undefined, b: number | undefined): boolean {
  return a === b || (a !== undefined && b !== undefined && Number.isNaN(a) && Number.isNaN(b));
}

export function mergeOntoNewer<P extends SetSnapshot["params"]>({ base, mine, theirs }: MergeInput<P>): MergeResult<P> {
  const taken: DiffFieldKey[] = [];
  const clashes: DiffFieldKey[] = [];
  const pick = <T>(key: DiffFieldKey, b: T, m: T, t: T, same: (x: T, y: T) => boolean): T => {
    if (same(b, m)) return t;
    taken.push(key);
    if (!same(b, t) && !same(m, t)) clashes.push(key);
    return m;
  };

  const name = pick("name", base.name, mine.name, theirs.name, (x, y) => x === y);
  const description = pick("description", base.description, mine.description, theirs.description, (x, y) => x === y);
  const tags = pick("tags", base.tags, mine.tags, theirs.tags, (x, y) => tagsKey(x) === tagsKey(y));
  const params = { ...theirs.params };
  for (const meta of PARAM_META) {
    const value = pick(meta.key, base.params[meta.key], mine.params[meta.key], theirs.params[meta.key], sameNumber);
    if (value === undefined) delete params[meta.key];
    else (params as SetSnapshot["params"])[meta.key] = value;
  }
  // A switch never stored reads as off (its default), as in the version diff.
  for (const meta of FLAG_META) {
    const on = (p: SetSnapshot["params"]) => p[meta.key] === true;
    const value = pick(meta.key, on(base.params), on(mine.params), on(theirs.params), (x, y) => x === y);
    if (value || meta.key in theirs.params) (params as SetSnapshot["params"])[meta.key] = value;
  }
  return { merged: { name, description, tags: [...tags], params }, mine: taken, clashes };
}
