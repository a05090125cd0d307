import { Bar, BarChart, CartesianGrid, LabelList, XAxis, YAxis } from "recharts";
import { axisStyle, chartColours, gridStyle } from "./chart-style";

/** A figure's bars by day, each labelled with its value so the chart reads without hovering. */
export function FiguresPlot({ points, format }: { points: { label: string; value: number }[]; format: (value: number) => string }) {
  return (
    <BarChart responsive data={points} style={{ width: "100%", height: "100%" }} margin={{ top: 20, right: 12, bottom: 4, left: 4 }} accessibilityLayer={false}>
      <CartesianGrid {...gridStyle} vertical={false} />
      <XAxis dataKey="label" {...axisStyle} />
      <YAxis domain={[0, "auto"]} tickFormatter={format} {...axisStyle} width={64} />
      <Bar dataKey="value" fill={chartColours.highlight} stroke={chartColours.axis} isAnimationActive={false}>
        <LabelList dataKey="value" position="top" formatter={(v: unknown) => format(Number(v))} style={{ fontSize: 12, fill: chartColours.text }} />
      </Bar>
    </BarChart>
  );
}
