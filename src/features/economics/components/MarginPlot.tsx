import { Bar, BarChart, CartesianGrid, Cell, ReferenceLine, XAxis, YAxis } from "recharts";
import { axisLabelStyle, axisStyle, chartColours, gridStyle } from "../../../components/chart/chart-style";

export interface MonthPoint {
  month: string;
  /** In whole major units, for the axis only; the table beside the chart holds the exact figures. */
  margin: number;
}

/** Each month's margin as a bar from zero: up in the good colour, down in the bad. */
export function MarginPlot({ points, yLabel }: { points: MonthPoint[]; yLabel: string }) {
  return (
    <BarChart responsive data={points} style={{ width: "100%", height: "100%" }} margin={{ top: 16, right: 16, bottom: 24, left: 24 }} accessibilityLayer={false}>
      <CartesianGrid {...gridStyle} vertical={false} />
      <XAxis dataKey="month" {...axisStyle} />
      <YAxis {...axisStyle} width={64} label={{ value: yLabel, angle: -90, position: "left", offset: 10, style: { ...axisLabelStyle, textAnchor: "middle" } }} />
      <ReferenceLine y={0} stroke={chartColours.axis} />
      <Bar dataKey="margin" isAnimationActive={false}>
        {points.map((point) => (
          <Cell key={point.month} fill={point.margin < 0 ? chartColours.bad : chartColours.good} />
        ))}
      </Bar>
    </BarChart>
  );
}
