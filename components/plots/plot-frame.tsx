import type { ReactNode, Ref } from "react";
import { AXIS_FONT, wrapText } from "./axes";

/*
 * The frame every plot shares: the SVG root (self-contained, so an export looks like the page),
 * a white background, the title, and the magneticScale banner of physics-model §4.3 on a line of
 * its own, so a long title can never run into it. A title wider than the plot wraps onto more
 * lines (and the plotting area moves down), so it is never cut off on a narrow screen.
 */

const TITLE_FONT_PX = 12;
const TITLE_LINE_PX = 15;
const TITLE_Y = 16;
const RIGHT_PAD_PX = 8;

/** The title's lines for a plot `width` wide whose title starts at x = `left`. */
export function titleLines(title: string, width: number, left: number): string[] {
  return wrapText(title, Math.max(80, width - left - RIGHT_PAD_PX), TITLE_FONT_PX);
}

/**
 * Top margin above the plotting area: the title (one line per wrapped line when the title and the
 * plot's width are given), plus a line for the banner when there is one.
 */
export function frameTop(banner: string | null | undefined, layout?: { title: string; width: number; left: number }): number {
  const extraLines = layout ? titleLines(layout.title, layout.width, layout.left).length - 1 : 0;
  return (banner ? 44 : 30) + extraLines * TITLE_LINE_PX;
}

export function PlotFrame({
  title,
  banner,
  width,
  height,
  left,
  svgRef,
  children,
}: {
  title: string;
  banner?: string | null;
  width: number;
  height: number;
  /** x of the plotting area's left edge; title and banner start there. */
  left: number;
  svgRef?: Ref<SVGSVGElement>;
  children: ReactNode;
}) {
  const lines = titleLines(title, width, left);
  const bannerY = TITLE_Y + (lines.length - 1) * TITLE_LINE_PX + 16;
  return (
    <svg
      ref={svgRef}
      xmlns="http://www.w3.org/2000/svg"
      width={width}
      height={height}
      viewBox={`0 0 ${width} ${height}`}
      role="img"
      aria-label={banner ? `${title} (${banner})` : title}
      fontFamily={AXIS_FONT}
    >
      <rect x={0} y={0} width={width} height={height} fill="#ffffff" />
      <text x={left} y={TITLE_Y} fontSize={TITLE_FONT_PX} fontWeight={600} fill="#1d2433">
        {lines.map((line, i) => (
          <tspan key={i} x={left} dy={i === 0 ? 0 : TITLE_LINE_PX}>
            {line}
          </tspan>
        ))}
      </text>
      {banner ? (
        <text x={left} y={bannerY} fontSize={11} fill="#a0470f" fontWeight={600}>
          {banner}
        </text>
      ) : null}
      {children}
    </svg>
  );
}
