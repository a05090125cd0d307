import { lazy } from "react";
import type { MonthFigures } from "@shared/economics/totals";
import { fromMinorUnits } from "@shared/money/minor-units";
import { ChartFrame } from "../../../components/chart/ChartFrame";
import { signedMoney } from "./figures";

// The chart library comes with the money chart, not with the rest of the app.
const MarginPlot = lazy(() => import("./MarginPlot").then((m) => ({ default: m.MarginPlot })));

/** The channel's margin month by month, described in words for those who don't see the bars. */
export function MarginChart({ months, currency }: { months: MonthFigures[]; currency: string }) {
  const points = months.map((m) => ({ month: m.month, margin: Number(fromMinorUnits(m.marginMinor, currency)) }));
  const description = months.map((m) => `${m.month}: ${signedMoney(m.marginMinor, currency)}.`).join(" ");
  return (
    <ChartFrame name={`Margin per month in ${currency}`} description={description} height={280}>
      <MarginPlot points={points} yLabel={`Margin (${currency})`} />
    </ChartFrame>
  );
}
