import { CartesianGrid, ReferenceLine, Scatter, ScatterChart, XAxis, YAxis } from "recharts";
import { formatNumber } from "@shared/bench/format";
import { axisLabelStyle, axisStyle, chartColours, gridStyle } from "../../../components/chart/chart-style";
import { Marker, type PlanLine, type PlotPoint, verdictColours } from "./chart-marks";

/**
 * The comparison drawn by the chart library: both axes from zero to a round value past the largest
 * figure or threshold, the plan's thresholds as dashed lines, each run as its verdict's mark.
 */
export function ComparisonPlot({ points, xLabel, yLabel, xLines, yLines }: { points: PlotPoint[]; xLabel: string; yLabel: string; xLines: PlanLine[]; yLines: PlanLine[] }) {
  return (
    <ScatterChart responsive style={{ width: "100%", height: "100%" }} margin={{ top: 24, right: 28, bottom: 34, left: 24 }} accessibilityLayer={false}>
      <CartesianGrid {...gridStyle} />
      <XAxis type="number" dataKey="x" name={xLabel} domain={[0, "auto"]} tickFormatter={formatNumber} {...axisStyle} label={{ value: xLabel, position: "bottom", offset: 12, style: axisLabelStyle }} />
      <YAxis type="number" dataKey="y" name={yLabel} domain={[0, "auto"]} tickFormatter={formatNumber} {...axisStyle} width={56} label={{ value: yLabel, angle: -90, position: "left", offset: 6, style: { ...axisLabelStyle, textAnchor: "middle" } }} />
      {yLines.map((line) => (
        <ReferenceLine key={`y${line.label}`} y={line.value} ifOverflow="extendDomain" stroke={chartColours.limit} strokeWidth={1.5} strokeDasharray="6 4" label={{ value: line.label, position: "insideTopLeft", fontSize: 11, fill: chartColours.limitText }} />
      ))}
      {xLines.map((line) => (
        <ReferenceLine key={`x${line.label}`} x={line.value} ifOverflow="extendDomain" stroke={chartColours.limit} strokeWidth={1.5} strokeDasharray="6 4" label={{ value: line.label, position: "insideTopRight", fontSize: 11, fill: chartColours.limitText }} />
      ))}
      <Scatter data={points} isAnimationActive={false} shape={(props: { cx?: number; cy?: number; payload?: PlotPoint }) => <RunMark {...props} />} />
    </ScatterChart>
  );
}

function RunMark({ cx, cy, payload }: { cx?: number; cy?: number; payload?: PlotPoint }) {
  if (cx === undefined || cy === undefined || !payload) return <g />;
  return (
    <g data-run={payload.number}>
      {payload.best && <circle cx={cx} cy={cy} r="14" fill="none" stroke={chartColours.highlight} strokeWidth="4" />}
      <Marker verdict={payload.verdict} cx={cx} cy={cy} colour={verdictColours[payload.verdict]} />
      <text x={cx + (payload.best ? 18 : 11)} y={cy - 8} fontSize="12" fontWeight={payload.best ? 700 : 500} fill={chartColours.text}>
        {payload.best ? `Best: run ${payload.number}` : `Run ${payload.number}`}
      </text>
    </g>
  );
}
