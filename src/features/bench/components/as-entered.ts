import { figureIn } from "@shared/bench/comparison";
import { formatNumber, formatQuantity } from "@shared/bench/format";
import type { Quantity } from "@shared/bench/quantity";

// Apart from ./marks, which the test plan sheet uses: converting loads mathjs.
/** A quantity as typed, with the comparison unit beside it when it differs: "9800 mA = 9.8 A". */
export function asEntered(quantity: Quantity, unit: string): string {
  if (quantity.unit === unit) return formatQuantity(quantity);
  const converted = figureIn(quantity, unit);
  return converted === null ? formatQuantity(quantity) : `${formatQuantity(quantity)} = ${formatNumber(converted)} ${unit}`;
}
