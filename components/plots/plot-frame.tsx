import type { ReactNode, Ref } from "react";
import { AXIS_FONT } from "./axes";

/*
 * The frame every plot shares: the SVG root (self-contained, so an export looks like the page),
 * a white background, the title, and the magneticScale banner of physics-model §4.3 on a line of
 * its own, so a long title can never run into it.
 */

const TITLE_Y = 16;
const BANNER_Y = 32;

/** Top margin above the plotting area: the title, plus a line for the banner when there is one. */
export function frameTop(banner: string | null | undefined): number {
  return banner ? 44 : 30;
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
      <text x={left} y={TITLE_Y} fontSize={12} fontWeight={600} fill="#1d2433">
        {title}
      </text>
      {banner ? (
        <text x={left} y={BANNER_Y} fontSize={11} fill="#a0470f" fontWeight={600}>
          {banner}
        </text>
      ) : null}
      {children}
    </svg>
  );
}
