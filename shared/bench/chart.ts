/**
 * Axis ticks at "nice" steps (1, 2 or 5 times a power of ten), after Paul Heckbert's "Nice Numbers
 * for Graph Labels" (Graphics Gems, 1990; the method from memory, the code our own). The axis
 * starts at zero, since masses, powers and ratios on the bench never go below it.
 */
export function niceTicks(max: number, count = 5): number[] {
  if (!(max > 0) || !Number.isFinite(max)) return [0, 1];
  const rough = max / count;
  const power = 10 ** Math.floor(Math.log10(rough));
  const fraction = rough / power;
  const step = (fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10) * power;
  const ticks: number[] = [];
  for (let i = 0; i * step < max + step * 1e-9 || ticks.length < 2; i++) ticks.push(Number((i * step).toPrecision(12)));
  if (ticks[ticks.length - 1]! < max) ticks.push(Number((ticks.length * step).toPrecision(12)));
  return ticks;
}

/** Maps a value in [0, domainMax] onto [from, to] (to may be smaller, as a y axis runs up the screen). */
export function scale(domainMax: number, from: number, to: number) {
  return (value: number) => from + (domainMax === 0 ? 0 : (value / domainMax) * (to - from));
}
