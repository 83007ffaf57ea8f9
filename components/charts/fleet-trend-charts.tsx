"use client";

import { Area, AreaChart, CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { ChartFigure } from "./chart-figure";
import { legendProps } from "./legend";
import { dayLabel } from "./format";
import { TONES } from "./palette";

export type TrendPoint = { day: string; ready: number; limited: number; notReady: number; meetingStandard: number; openGaps: number };

const tick = { fill: TONES.muted, fontSize: 12 };

function Empty() {
  return <p className="rounded-md border border-dashed border-line px-3 py-8 text-center text-muted">No daily figures recorded yet.</p>;
}

/** Vehicles ready, limited and not ready, week by week (stacked), with the table. */
export function ReadinessOverTimeChart({ points }: { points: TrendPoint[] }) {
  const data = points.map((p) => ({ ...p, label: dayLabel(p.day) }));
  return (
    <ChartFigure
      testId="chart-readiness"
      title="Fleet readiness over time"
      description="Vehicles ready for remote duty, limited to town and graded roads, and not ready, at the end of each week."
      table={
        <Table label="Fleet readiness over time, as a table">
          <THead>
            <Tr>
              <Th>Week ending</Th>
              <Th numeric>Ready</Th>
              <Th numeric>Limited</Th>
              <Th numeric>Not ready</Th>
            </Tr>
          </THead>
          <TBody>
            {points.map((p) => (
              <Tr key={p.day}>
                <Th scope="row">{dayLabel(p.day)}</Th>
                <Td numeric>{p.ready}</Td>
                <Td numeric>{p.limited}</Td>
                <Td numeric>{p.notReady}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      }
    >
      {points.length === 0 ? (
        <Empty />
      ) : (
        <div className="h-72 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <AreaChart data={data} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} title="Fleet readiness over time">
              <defs>
                <pattern id="readiness-limited" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
                  <rect width="6" height="6" fill="var(--color-spinifex-300)" />
                  <rect width="2" height="6" fill="var(--color-spinifex-600)" />
                </pattern>
                <pattern id="readiness-not-ready" width="6" height="6" patternUnits="userSpaceOnUse">
                  <rect width="6" height="6" fill="var(--color-earth-500)" />
                  <circle cx="3" cy="3" r="1.3" fill="white" fillOpacity="0.7" />
                </pattern>
              </defs>
              <CartesianGrid stroke={TONES.grid} vertical={false} />
              <XAxis dataKey="label" tick={tick} minTickGap={24} />
              <YAxis allowDecimals={false} tick={tick} width={40} />
              <Tooltip />
              <Legend {...legendProps} />
              <Area dataKey="ready" name="Ready" stackId="r" type="stepAfter" fill="var(--color-saltbush-500)" stroke="var(--color-saltbush-800)" fillOpacity={0.9} isAnimationActive={false} />
              <Area dataKey="limited" name="Limited" stackId="r" type="stepAfter" fill="url(#readiness-limited)" stroke="var(--color-spinifex-700)" fillOpacity={0.9} isAnimationActive={false} />
              <Area dataKey="notReady" name="Not ready" stackId="r" type="stepAfter" fill="url(#readiness-not-ready)" stroke="var(--color-earth-800)" fillOpacity={0.9} isAnimationActive={false} />
            </AreaChart>
          </ResponsiveContainer>
        </div>
      )}
    </ChartFigure>
  );
}

/** Open gap lines falling and vehicles meeting their standard rising, week by week. */
export function VarianceClosingChart({ points }: { points: TrendPoint[] }) {
  const data = points.map((p) => ({ ...p, label: dayLabel(p.day) }));
  return (
    <ChartFigure
      testId="chart-variance"
      title="Variance closing over time"
      description="Open gap lines across the fleet (short, off-spec or unproven; solid line with circles) and vehicles fully meeting their standard (dashed line with squares), at the end of each week."
      table={
        <Table label="Variance closing over time, as a table">
          <THead>
            <Tr>
              <Th>Week ending</Th>
              <Th numeric>Open gap lines</Th>
              <Th numeric>Vehicles meeting standard</Th>
            </Tr>
          </THead>
          <TBody>
            {points.map((p) => (
              <Tr key={p.day}>
                <Th scope="row">{dayLabel(p.day)}</Th>
                <Td numeric>{p.openGaps}</Td>
                <Td numeric>{p.meetingStandard}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      }
    >
      {points.length === 0 ? (
        <Empty />
      ) : (
        <div className="h-72 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={data} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} title="Variance closing over time">
              <CartesianGrid stroke={TONES.grid} vertical={false} />
              <XAxis dataKey="label" tick={tick} minTickGap={24} />
              <YAxis allowDecimals={false} tick={tick} width={40} />
              <Tooltip />
              <Legend {...legendProps} />
              <Line dataKey="openGaps" name="Open gap lines" stroke="var(--color-earth-600)" strokeWidth={2.5} dot={{ r: 3, fill: "var(--color-earth-600)" }} isAnimationActive={false} />
              <Line
                dataKey="meetingStandard"
                name="Vehicles meeting standard"
                stroke="var(--color-night-700)"
                strokeWidth={2.5}
                strokeDasharray="6 4"
                dot={(props: { cx?: number; cy?: number; index?: number }) => (
                  <rect key={props.index} x={(props.cx ?? 0) - 3} y={(props.cy ?? 0) - 3} width={6} height={6} fill="var(--color-night-700)" />
                )}
                isAnimationActive={false}
              />
            </LineChart>
          </ResponsiveContainer>
        </div>
      )}
    </ChartFigure>
  );
}
