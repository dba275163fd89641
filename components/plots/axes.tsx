import { type NumScale, type ScaleType, ticksOf } from "./scale";

/*
 * Axes drawn by React from d3 scales (no DOM-touching d3). Styling is by SVG attributes, not CSS
 * classes, so an exported SVG looks the same outside the page.
 */

/**
 * The product's font first; an exported SVG opened where Inter is not installed (a journal's
 * editor, Inkscape, another machine) falls back to fonts most systems have with similar widths,
 * then to the generic sans-serif, so labels never fall to a serif default.
 */
export const AXIS_FONT = "'Inter Variable', Inter, 'DejaVu Sans', 'Liberation Sans', Arial, Helvetica, sans-serif";
const INK = "#1d2433";
const SOFT = "#4a5468";
const GRID = "#e3e0d8";
const TICK_FONT_PX = 11;
const LABEL_FONT_PX = 12;

/*
 * Text widths without measuring the DOM (exports and tests have none): Inter's average advance is
 * about 0.58 em for digits and lower case; a little generous, so estimates err toward space.
 */
export function estimateTextWidth(text: string, fontPx: number): number {
  return text.length * fontPx * 0.6;
}

/** Splits text at spaces into lines no wider than maxPx (a single long word stays whole). */
export function wrapText(text: string, maxPx: number, fontPx: number): string[] {
  const words = text.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let line = "";
  for (const word of words) {
    const next = line ? `${line} ${word}` : word;
    if (line && estimateTextWidth(next, fontPx) > maxPx) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines.length > 0 ? lines : [""];
}

/** About one labelled tick per 70 px of axis, so narrow plots get fewer ticks. */
export function tickCountFor(spanPx: number, wanted: number): number {
  return Math.max(2, Math.min(wanted, Math.floor(spanPx / 70)));
}

/**
 * Keeps tick labels from colliding: walking along the axis, a label is dropped when it would
 * overlap the last one kept (the tick mark stays).
 */
export function spaceOutLabels<T extends { px: number; label: string }>(ticks: readonly T[], fontPx = TICK_FONT_PX, gapPx = 6): T[] {
  const sorted = [...ticks].sort((a, b) => a.px - b.px);
  let lastRight = -Infinity;
  return sorted.map((t) => {
    if (!t.label) return t;
    const half = estimateTextWidth(t.label, fontPx) / 2;
    if (t.px - half < lastRight + gapPx) return { ...t, label: "" };
    lastRight = t.px + half;
    return t;
  });
}

export function XAxis({
  scale,
  type,
  y,
  height,
  label,
  count = 8,
}: {
  scale: NumScale;
  type: ScaleType;
  y: number;
  height: number;
  label: string;
  count?: number;
}) {
  const [r0, r1] = scale.range() as [number, number];
  const ticks = spaceOutLabels(ticksOf(scale, type, tickCountFor(Math.abs(r1 - r0), count)).map((t) => ({ ...t, px: scale(t.value) })));
  return (
    <g aria-hidden="true">
      {ticks.map((t) => {
        const x = t.px;
        return (
          <g key={`x${t.value}`} transform={`translate(${x},0)`}>
            {t.major ? <line y1={y - height} y2={y} stroke={GRID} strokeWidth={1} /> : null}
            <line y1={y} y2={y + (t.major ? 6 : 3)} stroke={SOFT} />
            {t.label ? (
              <text y={y + 18} textAnchor="middle" fontSize={TICK_FONT_PX} fill={SOFT} fontFamily={AXIS_FONT}>
                {t.label}
              </text>
            ) : null}
          </g>
        );
      })}
      <line x1={Math.min(r0, r1)} x2={Math.max(r0, r1)} y1={y} y2={y} stroke={SOFT} />
      <text x={(r0 + r1) / 2} y={y + 36} textAnchor="middle" fontSize={LABEL_FONT_PX} fill={INK} fontFamily={AXIS_FONT}>
        {label}
      </text>
    </g>
  );
}

export function YAxis({
  scale,
  type,
  x,
  width,
  label,
  count = 6,
}: {
  scale: NumScale;
  type: ScaleType;
  x: number;
  width: number;
  label: string;
  count?: number;
}) {
  const [r0, r1] = scale.range() as [number, number];
  const ticks = ticksOf(scale, type, count);
  const labelLines = wrapText(label, Math.abs(r1 - r0), LABEL_FONT_PX);
  return (
    <g aria-hidden="true">
      {ticks.map((t) => {
        const y = scale(t.value);
        return (
          <g key={`y${t.value}`} transform={`translate(0,${y})`}>
            {t.major ? <line x1={x} x2={x + width} stroke={GRID} strokeWidth={1} /> : null}
            <line x1={x - (t.major ? 6 : 3)} x2={x} stroke={SOFT} />
            {t.label ? (
              <text x={x - 9} dy="0.32em" textAnchor="end" fontSize={TICK_FONT_PX} fill={SOFT} fontFamily={AXIS_FONT}>
                {t.label}
              </text>
            ) : null}
          </g>
        );
      })}
      <line x1={x} x2={x} y1={Math.min(r0, r1)} y2={Math.max(r0, r1)} stroke={SOFT} />
      {/* A label longer than the axis is wrapped (second line toward the axis), never cut off. */}
      <text
        transform={`translate(${x - 54 - (labelLines.length - 1) * 7},${(r0 + r1) / 2}) rotate(-90)`}
        textAnchor="middle"
        fontSize={LABEL_FONT_PX}
        fill={INK}
        fontFamily={AXIS_FONT}
      >
        {labelLines.map((line, i) => (
          <tspan key={i} x={0} dy={i === 0 ? 0 : LABEL_FONT_PX + 2}>
            {line}
          </tspan>
        ))}
      </text>
    </g>
  );
}
