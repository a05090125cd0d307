import { lazy } from "react";
import { ChartFrame } from "./ChartFrame";

// The chart library comes with a figures chart, not with the pages around it.
const FiguresPlot = lazy(() => import("./FiguresPlot").then((m) => ({ default: m.FiguresPlot })));

export interface FigureSeries {
  name: string;
  points: { label: string; value: number }[];
}

/** One small bar chart per figure (views, clicks… have different scales), each bar a day after go-live. */
export function FiguresChart({ series, format, subject }: { series: FigureSeries[]; format: (value: number) => string; subject: string }) {
  if (series.length === 0) return <p className="text-sm text-graphite-700">No figures yet: the chart appears with the first ones entered.</p>;
  return (
    <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
      {series.map((s) => (
        <figure key={s.name} className="min-w-0 break-inside-avoid" data-figure-chart>
          <figcaption className="text-sm font-semibold text-graphite-900">{s.name}</figcaption>
          <ChartFrame name={`${s.name} of ${subject}, by day after go-live`} description={s.points.map((p) => `${p.label}: ${format(p.value)}.`).join(" ")} height={200}>
            <FiguresPlot points={s.points} format={format} />
          </ChartFrame>
        </figure>
      ))}
    </div>
  );
}
