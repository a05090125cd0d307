import { useState } from "react";
import { type DealMoneyView, type EntryView, type EpisodeMoneyView, entryKindLabels, purchaseCategoryLabels } from "@shared/economics/schemas";
import { MAX_STILL_BYTES, stillTypes } from "@shared/rushes/limits";
import { Button } from "../../../components/Button";
import { FormOpener } from "../../../components/FormOpener";
import { NumberField } from "../../../components/form-fields";
import { Empty, QueryState } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { formatDay, formatDuration, formatMinorMoney } from "../../../lib/format";
import { useAddReceipt } from "../api/add-receipt";
import { useDeleteEntry } from "../api/delete-entry";
import { useEpisodeMoney } from "../api/get-episode-money";
import { useSetDealRate } from "../api/set-deal-rate";
import { EntryForm } from "./EntryForm";
import { Figure, signedMoney } from "./figures";

/** The episode's costs and income: owner and producer only (the page shows the part to no one else). */
export function EpisodeMoney({ channelId, episodeId }: EpisodeSectionProps) {
  return (
    <QueryState query={useEpisodeMoney(channelId, episodeId)} loading="Loading the episode's money…">
      {(money) => <MoneyOfEpisode channelId={channelId} episodeId={episodeId} money={money} />}
    </QueryState>
  );
}

function MoneyOfEpisode({ channelId, episodeId, money }: { channelId: string; episodeId: string; money: EpisodeMoneyView }) {
  const { totals, settings } = money;
  const currency = settings.currency;
  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="money-totals" className="rounded-lg border border-ply-300 bg-white p-4">
        <h3 id="money-totals" className="font-semibold">
          Totals in {currency}
        </h3>
        <dl className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-4">
          <Figure label="Costs" value={formatMinorMoney(totals.costsMinor, currency)} />
          <Figure label="Money in" value={formatMinorMoney(totals.receivedMinor, currency)} />
          <Figure label="Margin so far" value={signedMoney(totals.marginMinor, currency)} tone={totals.marginMinor < 0 ? "bad" : "good"} testId="margin-so-far" />
          <Figure label="Margin once all fees are paid" value={signedMoney(totals.expectedMarginMinor, currency)} />
        </dl>
        <p className="mt-3 text-sm text-graphite-700">
          Parts {formatMinorMoney(totals.partsMinor, currency)} · other purchases {formatMinorMoney(totals.purchasesMinor, currency)} · hours {formatMinorMoney(totals.hoursMinor, currency)} · fees paid{" "}
          {formatMinorMoney(totals.paidMinor, currency)} of {formatMinorMoney(totals.feesMinor, currency)} · other income {formatMinorMoney(totals.otherIncomeMinor, currency)}
        </p>
        <Budget money={money} />
        {totals.uncounted > 0 && (
          <p className="mt-2 text-sm text-rust-700">
            {totals.uncounted === 1 ? "One line is" : `${totals.uncounted} lines are`} left out of the totals: a rate or the channel's hourly rate is missing.
          </p>
        )}
      </section>
      <Deals channelId={channelId} episodeId={episodeId} deals={money.deals} currency={currency} />
      <section aria-labelledby="money-lines">
        <h3 id="money-lines" className="mb-2 font-semibold">
          Costs and other income
        </h3>
        {money.entries.length === 0 ? (
          <Empty title="Nothing recorded yet">Add the parts used, other purchases, hours worked and any income besides sponsor fees.</Empty>
        ) : (
          <ul className="flex flex-col gap-2">
            {money.entries.map((entry) => (
              <EntryItem key={entry.id} channelId={channelId} episodeId={episodeId} entry={entry} channelCurrency={currency} />
            ))}
          </ul>
        )}
        <FormOpener label="Add a line" className="mt-3">
          {(close) => <EntryForm channelId={channelId} episodeId={episodeId} money={money} onDone={close} />}
        </FormOpener>
        {settings.hourRateMinor === null && <p className="mt-2 text-xs text-graphite-500">Hours count once the channel sets an hourly rate on the Money page.</p>}
      </section>
    </div>
  );
}

function Budget({ money }: { money: EpisodeMoneyView }) {
  const { budget } = money;
  if (!budget) return <p className="mt-2 text-sm text-graphite-500">No rough budget on the episode's overview.</p>;
  const planned = formatMinorMoney(budget.amountMinor, budget.currency);
  if (!budget.comparable || budget.leftMinor === null) {
    return <p className="mt-2 text-sm text-graphite-700">Rough budget {planned}: not compared, as the totals are in {money.settings.currency}.</p>;
  }
  const over = budget.leftMinor < 0;
  return (
    <p className={`mt-2 text-sm ${over ? "font-semibold text-alarm-600" : "text-graphite-700"}`} data-testid="budget">
      Rough budget {planned}, spent {formatMinorMoney(money.totals.costsMinor, budget.currency)}: {over ? `${formatMinorMoney(-budget.leftMinor, budget.currency)} over` : `${formatMinorMoney(budget.leftMinor, budget.currency)} left`}.
    </p>
  );
}

function Deals({ channelId, episodeId, deals, currency }: { channelId: string; episodeId: string; deals: DealMoneyView[]; currency: string }) {
  return (
    <section aria-labelledby="money-deals">
      <h3 id="money-deals" className="mb-2 font-semibold">
        Sponsor fees
      </h3>
      {deals.length === 0 ? (
        <p className="text-sm text-graphite-500">No signed deal on this episode.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {deals.map((deal) => (
            <li key={deal.dealId} className="rounded-md border border-ply-300 bg-white p-3 text-sm">
              <p className="font-semibold">{deal.company}</p>
              <p>
                Fee {formatMinorMoney(deal.feeMinor, deal.currency)} · invoiced {formatMinorMoney(deal.invoicedMinor, deal.currency)} · <span data-testid="deal-paid">paid {formatMinorMoney(deal.paidMinor, deal.currency)}</span>
              </p>
              {deal.currency !== currency && <DealRate channelId={channelId} episodeId={episodeId} deal={deal} currency={currency} />}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function DealRate({ channelId, episodeId, deal, currency }: { channelId: string; episodeId: string; deal: DealMoneyView; currency: string }) {
  const [rate, setRate] = useState(deal.rate ?? "");
  const save = useSetDealRate(channelId, episodeId);
  return (
    <form
      className="mt-2 flex flex-wrap items-end gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        save.mutate({ dealId: deal.dealId, rate });
      }}
    >
      <NumberField label={`Rate: one ${deal.currency} in ${currency}`} value={rate} onChange={(event) => setRate(event.target.value)} error={save.error?.message} />
      <Button type="submit" tone="quiet" busy={save.isPending}>
        Keep the rate
      </Button>
      {!deal.channel && <span className="text-xs text-rust-700">Not in the totals until its rate is entered.</span>}
    </form>
  );
}

function describe(entry: EntryView): string {
  if (entry.kind === "part") return `${entry.quantity ?? 0} × ${entry.partName ?? entry.label}${entry.source ? `, from ${entry.source}` : ""}`;
  if (entry.kind === "hours") return `${entry.memberName ?? "A former member"}, ${formatDuration((entry.minutes ?? 0) * 60_000, { smallest: "min" })}${entry.label ? `: ${entry.label}` : ""}`;
  if (entry.kind === "purchase") return `${purchaseCategoryLabels[entry.category ?? "other"]}: ${entry.label}${entry.source ? `, from ${entry.source}` : ""}`;
  return entry.label;
}

function EntryItem({ channelId, episodeId, entry, channelCurrency }: { channelId: string; episodeId: string; entry: EntryView; channelCurrency: string }) {
  const remove = useDeleteEntry(channelId, episodeId);
  const receipt = useAddReceipt(channelId, episodeId);
  const amount = entry.amountMinor === null ? "no hourly rate yet" : formatMinorMoney(entry.amountMinor, entry.currency);
  const converted = entry.rate && entry.channelMinor !== null ? ` = ${formatMinorMoney(entry.channelMinor, channelCurrency)} at ${entry.rate}` : "";
  return (
    <li className="flex flex-col gap-2 rounded-md border border-ply-300 bg-white p-3 text-sm sm:flex-row sm:items-start sm:justify-between">
      <div className="min-w-0">
        <p className="text-xs text-graphite-500">
          {entryKindLabels[entry.kind]} · {formatDay(entry.occurredOn)}
        </p>
        <p className="break-words">{describe(entry)}</p>
        <p className={entry.kind === "income" ? "font-semibold text-moss-600" : "font-semibold"}>
          {entry.kind === "income" ? "+" : "−"}
          {amount}
          {converted}
        </p>
        {entry.receipt && (
          <a className="text-xs underline" href={entry.receipt.url} target="_blank" rel="noreferrer">
            Receipt: {entry.receipt.fileName}
          </a>
        )}
        {receipt.error && <p className="text-xs text-alarm-600">{receipt.error.message}</p>}
      </div>
      <div className="flex flex-wrap gap-2">
        {entry.kind === "purchase" && (
          <label className="inline-flex cursor-pointer items-center rounded-md border border-ply-300 px-3 py-1.5 text-xs font-semibold focus-within:outline-2">
            {receipt.isPending ? "Sending…" : entry.receipt ? "Replace the receipt" : "Add a receipt"}
            <input
              type="file"
              className="sr-only"
              accept={[...new Set(Object.values(stillTypes))].join(",")}
              onChange={(event) => {
                const file = event.target.files?.[0];
                event.target.value = "";
                if (file && file.size <= MAX_STILL_BYTES) receipt.mutate({ entryId: entry.id, file });
              }}
            />
          </label>
        )}
        <Button tone="quiet" className="px-3 py-1.5 text-xs" busy={remove.isPending} onClick={() => remove.mutate(entry.id)} aria-label={`Remove ${describe(entry)}`}>
          Remove
        </Button>
      </div>
    </li>
  );
}
