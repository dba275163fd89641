"use client";

import { useMemo } from "react";
import { XAxis, YAxis } from "@/components/plots/axes";
import { PlotFrame, frameTop } from "@/components/plots/plot-frame";
import { makeScale } from "@/components/plots/scale";
import { useElementWidth } from "@/components/plots/use-element-size";
import type { ProfileInterval } from "@/lib/fit/inference";
import { fmt } from "@/lib/workbench/format";

/*
 * The profile of magneticScale: Δχ² against the value with every other fitted parameter refitted
 * at each step, the levels 1 and 4 whose crossings are the 68.27 % and 95.45 % intervals, and the
 * two tested values (0: no magnetic-dipole part; 1: first principles) marked where they fall.
 */

const LEVELS = [
  { level: 1, label: "Δχ² = 1 (68 %)" },
  { level: 4, label: "Δχ² = 4 (95 %)" },
];

export function ProfilePlot({ profile, label }: { profile: ProfileInterval; label: string }) {
  const [ref, width] = useElementWidth<HTMLDivElement>(640);
  const height = 240;
  const M = { left: 56, right: 16, bottom: 44, top: frameTop(null) };
  const curve = profile.curve;
  const xDomain = useMemo<[number, number]>(() => {
    const xs = curve.map((p) => p.value);
    const lo = Math.min(...xs, profile.interval95[0]);
    const hi = Math.max(...xs, profile.interval95[1]);
    const pad = (hi - lo) * 0.05 || 0.5;
    return [lo - pad, hi + pad];
  }, [curve, profile.interval95]);
  // The scan stops just past Δχ² = 4; a few points beyond are kept in view without squashing the levels.
  const yMax = Math.max(5, Math.min(12, ...curve.map((p) => p.deltaChi2)));
  const x = useMemo(() => makeScale("linear", xDomain, [M.left, width - M.right]), [xDomain, width, M.left, M.right]);
  const y = useMemo(() => makeScale("linear", [0, yMax], [height - M.bottom, M.top]), [yMax, M.bottom, M.top]);
  const clampY = (v: number) => y(Math.min(v, yMax));
  const path = curve.map((p, i) => `${i === 0 ? "M" : "L"}${x(p.value).toFixed(1)},${clampY(p.deltaChi2).toFixed(1)}`).join("");
  const tested = [0, 1].filter((v) => v >= xDomain[0] && v <= xDomain[1]);
  return (
    <div ref={ref} className="w-full">
      <PlotFrame title={`Profile of ${label}: Δχ² with the other parameters refitted`} width={width} height={height} left={M.left}>
        <XAxis scale={x} type="linear" y={height - M.bottom} height={height - M.bottom - M.top} label={label} />
        <YAxis scale={y} type="linear" x={M.left} width={width - M.left - M.right} label="Δχ²" />
        {LEVELS.map(({ level, label: text }) => (
          <g key={level}>
            <line x1={M.left} x2={width - M.right} y1={y(level)} y2={y(level)} stroke="#8a94a6" strokeDasharray="4 3" />
            <text x={width - M.right - 4} y={y(level) - 4} textAnchor="end" fontSize={11} fill="#4a5366">
              {text}
            </text>
          </g>
        ))}
        {tested.map((v) => (
          <line key={v} x1={x(v)} x2={x(v)} y1={M.top} y2={height - M.bottom} stroke="#b4441c" strokeDasharray="2 3">
            <title>{v === 0 ? "magneticScale = 0: no magnetic-dipole part" : "magneticScale = 1: first principles"}</title>
          </line>
        ))}
        <path d={path} fill="none" stroke="#1f5fa8" strokeWidth={2} />
        {curve.map((p) => (
          <circle key={p.value} cx={x(p.value)} cy={clampY(p.deltaChi2)} r={2.5} fill="#1f5fa8">
            <title>{`${label} = ${fmt(p.value)}: Δχ² = ${fmt(p.deltaChi2, 3)}`}</title>
          </circle>
        ))}
      </PlotFrame>
    </div>
  );
}
