/**
 * Kerf's four quick judgements of a viewer's idea, each 1 (low) to 3 (high):
 * - draw: how many viewers it would pull in;
 * - reach: how sure the crew is they can build it;
 * - spend: what it would cost in parts and days;
 * - danger: how much care it needs (blades, batteries, heat, height).
 * Kerf's own dimensions, named for this product.
 */
export const dimensions = ["draw", "reach", "spend", "danger"] as const;
export type Dimension = (typeof dimensions)[number];

export const dimensionLabels: Record<Dimension, { name: string; low: string; high: string }> = {
  draw: { name: "Draw", low: "few would watch", high: "many would watch" },
  reach: { name: "Within reach", low: "a long shot", high: "we can build it" },
  spend: { name: "Spend", low: "cheap", high: "costly" },
  danger: { name: "Danger", low: "little risk", high: "needs real care" },
};

/** Whether a higher score makes the idea more attractive (spend and danger count against it). */
const favours: Record<Dimension, 1 | -1> = { draw: 1, reach: 1, spend: -1, danger: -1 };

export type Scores = Record<Dimension, number>;

/** Each dimension's mean over the members who judged, rounded to one decimal; null when nobody has. */
export function combine(judgements: readonly Scores[]): Record<Dimension, number | null> {
  const out = {} as Record<Dimension, number | null>;
  for (const d of dimensions) {
    out[d] = judgements.length === 0 ? null : Math.round((judgements.reduce((sum, j) => sum + j[d], 0) / judgements.length) * 10) / 10;
  }
  return out;
}

/**
 * One figure to sort by: the mean of the four, with spend and danger turned round (4 − score), so 3
 * is the most attractive and 1 the least. Rounded to one decimal; null when nobody has judged.
 */
export function combinedScore(means: Record<Dimension, number | null>): number | null {
  const values = dimensions.map((d) => means[d]);
  if (values.some((v) => v === null)) return null;
  const total = dimensions.reduce((sum, d) => sum + (favours[d] === 1 ? means[d]! : 4 - means[d]!), 0);
  return Math.round((total / dimensions.length) * 10) / 10;
}
