/**
 * An episode's margin and the channel's months, from figures already in the channel's currency
 * (conversion.ts). Lines that count nothing yet (hours without a rate, a fee in another currency
 * without its rate) are counted in `uncounted` so the page can say the totals leave them out.
 */
export interface CountedLine {
  kind: "part" | "purchase" | "hours" | "income";
  channelMinor: number | null;
}

export interface CountedDeal {
  /** In the channel's currency, or null while the fee's rate is missing. */
  channel: { feeMinor: number; invoicedMinor: number; paidMinor: number } | null;
}

export interface EpisodeTotals {
  partsMinor: number;
  purchasesMinor: number;
  hoursMinor: number;
  costsMinor: number;
  feesMinor: number;
  invoicedMinor: number;
  paidMinor: number;
  otherIncomeMinor: number;
  /** Paid fees and other income: money in. */
  receivedMinor: number;
  /** Money in less costs, as of now. */
  marginMinor: number;
  /** Every agreed fee and other income less costs: the margin once every invoice is paid. */
  expectedMarginMinor: number;
  uncounted: number;
}

const sum = (values: number[]) => values.reduce((total, value) => total + value, 0);

export function episodeTotals(lines: readonly CountedLine[], deals: readonly CountedDeal[]): EpisodeTotals {
  const of = (kind: CountedLine["kind"]) => sum(lines.filter((line) => line.kind === kind).map((line) => line.channelMinor ?? 0));
  const partsMinor = of("part");
  const purchasesMinor = of("purchase");
  const hoursMinor = of("hours");
  const otherIncomeMinor = of("income");
  const counted = deals.flatMap((deal) => (deal.channel ? [deal.channel] : []));
  const feesMinor = sum(counted.map((deal) => deal.feeMinor));
  const paidMinor = sum(counted.map((deal) => deal.paidMinor));
  const costsMinor = partsMinor + purchasesMinor + hoursMinor;
  const receivedMinor = paidMinor + otherIncomeMinor;
  return {
    partsMinor,
    purchasesMinor,
    hoursMinor,
    costsMinor,
    feesMinor,
    invoicedMinor: sum(counted.map((deal) => deal.invoicedMinor)),
    paidMinor,
    otherIncomeMinor,
    receivedMinor,
    marginMinor: receivedMinor - costsMinor,
    expectedMarginMinor: feesMinor + otherIncomeMinor - costsMinor,
    uncounted: lines.filter((line) => line.channelMinor === null).length + (deals.length - counted.length),
  };
}

/** A month's money in and out, "2027-03". */
export interface MonthFigures {
  month: string;
  incomeMinor: number;
  costsMinor: number;
  marginMinor: number;
}

export interface DatedAmount {
  /** "YYYY-MM-DD": when it was spent, or when the money came in. */
  on: string;
  side: "cost" | "income";
  channelMinor: number;
}

function nextMonth(month: string): string {
  const [year, number] = month.split("-").map(Number) as [number, number];
  return number === 12 ? `${year + 1}-01` : `${year}-${String(number + 1).padStart(2, "0")}`;
}

/** Money in and out per calendar month, every month from the first to the last with money, none skipped. */
export function monthlyMargins(amounts: readonly DatedAmount[]): MonthFigures[] {
  if (amounts.length === 0) return [];
  const byMonth = new Map<string, { income: number; costs: number }>();
  for (const amount of amounts) {
    const month = amount.on.slice(0, 7);
    const figures = byMonth.get(month) ?? { income: 0, costs: 0 };
    if (amount.side === "income") figures.income += amount.channelMinor;
    else figures.costs += amount.channelMinor;
    byMonth.set(month, figures);
  }
  const months = [...byMonth.keys()].sort();
  const last = months.at(-1)!;
  const result: MonthFigures[] = [];
  for (let month = months[0]!; month <= last; month = nextMonth(month)) {
    const figures = byMonth.get(month) ?? { income: 0, costs: 0 };
    result.push({ month, incomeMinor: figures.income, costsMinor: figures.costs, marginMinor: figures.income - figures.costs });
  }
  return result;
}
