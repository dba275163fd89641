/*
 * Marker labels along the top of a plot. Labels of nearby markers (1030 and 1064 nm on a wide
 * axis) would print over each other; each label goes on the first row where it clears the
 * labels already placed, and flips to the left of its line at the right edge. The layout is
 * part of the SVG, so PNG and SVG exports carry it unchanged.
 */

export interface LabelInput {
  /** Pixel x of the marker line. */
  x: number;
  text: string;
}

export interface PlacedLabel {
  x: number;
  text: string;
  /** x where the text is drawn, with its anchor. */
  textX: number;
  anchor: "start" | "end";
  row: number;
}

export interface LabelLayoutOptions {
  left: number;
  right: number;
  /** Estimated width of one character in px (10 px sans-serif digits are about 5.6 px wide). */
  charWidth?: number;
  /** Gap between the line and its label, and between labels. */
  gap?: number;
  maxRows?: number;
}

export function labelWidth(text: string, charWidth = 6): number {
  return text.length * charWidth;
}

export function layoutMarkerLabels(labels: readonly LabelInput[], options: LabelLayoutOptions): PlacedLabel[] {
  const { left, right, charWidth = 6, gap = 3, maxRows = 4 } = options;
  const order = labels.map((l, i) => ({ l, i })).sort((p, q) => p.l.x - q.l.x);
  // Right edge of the last label on each row.
  const rowEnds: number[] = [];
  const placed: PlacedLabel[] = new Array(labels.length);
  for (const { l, i } of order) {
    const w = labelWidth(l.text, charWidth);
    const flip = l.x + gap + w > right;
    const start = flip ? Math.max(left, l.x - gap - w) : l.x + gap;
    const end = start + w;
    let row = rowEnds.findIndex((e) => e + gap <= start);
    if (row < 0 && rowEnds.length < maxRows) row = rowEnds.length;
    // Out of rows: the row that frees up first (overlap is then the least).
    if (row < 0) row = rowEnds.indexOf(Math.min(...rowEnds));
    rowEnds[row] = Math.max(rowEnds[row] ?? -Infinity, end);
    placed[i] = { x: l.x, text: l.text, textX: flip ? start + w : start, anchor: flip ? "end" : "start", row };
  }
  return placed;
}

/** True when two placed labels on the same row overlap (used by the tests and as a guard). */
export function labelsOverlap(a: PlacedLabel, b: PlacedLabel, charWidth = 6): boolean {
  if (a.row !== b.row) return false;
  const span = (p: PlacedLabel) => {
    const w = labelWidth(p.text, charWidth);
    return p.anchor === "start" ? [p.textX, p.textX + w] : [p.textX - w, p.textX];
  };
  const [a0, a1] = span(a);
  const [b0, b1] = span(b);
  return a0! < b1! && b0! < a1!;
}
