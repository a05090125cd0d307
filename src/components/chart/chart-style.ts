/**
 * How every Kerf chart looks, in one place: the house colours (the same custom properties the pages
 * use), the axes' type and lines, and the colours of a series by what it means. Plain values, no chart
 * library, so a page can read them without loading one.
 */
export const chartColours = {
  /** A result that meets what was asked. */
  good: "var(--color-moss-600)",
  /** A result that misses it. */
  bad: "var(--color-alarm-600)",
  /** Not decided yet (a figure is missing). */
  open: "var(--color-graphite-500)",
  /** The one to look at first (the best candidate). */
  highlight: "var(--color-amber-cut)",
  /** A limit or target drawn across the chart. */
  limit: "var(--color-rust-600)",
  limitText: "var(--color-rust-700)",
  plot: "var(--color-ply-50)",
  grid: "var(--color-ply-200)",
  axis: "var(--color-graphite-900)",
  tick: "var(--color-graphite-700)",
  text: "var(--color-graphite-900)",
} as const;

/** Props for a chart library's axis: ticks in small grey type, the axis line dark, labels bold. */
export const axisStyle = {
  stroke: chartColours.axis,
  strokeWidth: 1.5,
  tick: { fontSize: 12, fill: chartColours.tick },
  tickLine: { stroke: chartColours.grid },
} as const;

export const axisLabelStyle = { fontSize: 13, fontWeight: 600, fill: chartColours.text } as const;

export const gridStyle = { stroke: chartColours.grid, fill: chartColours.plot } as const;
