import { Link } from "react-router-dom";
import type { ChannelMoneyView } from "@shared/economics/schemas";
import { roleMay } from "@shared/access/roles";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { formatMinorMoney } from "../../../lib/format";
import { useChannel } from "../../../lib/session";
import { useChannelMoney } from "../api/get-channel-money";
import { moneyBase } from "../api/keys";
import { signedMoney } from "./figures";
import { MarginChart } from "./MarginChart";
import { MoneySettingsForm } from "./MoneySettingsForm";

/** The channel's money: margin per month, per episode, the export, and the currency and hourly rate. */
export function MoneyPage() {
  const channel = useChannel();
  if (!roleMay(channel.role, "money", "R")) return <Empty title="Not for your role">Costs and income are for the channel's owner and producer.</Empty>;
  return <Money channelId={channel.channelId} />;
}

function Money({ channelId }: { channelId: string }) {
  const query = useChannelMoney(channelId);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Money"
        subtitle="What each episode cost and earned, month by month."
        actions={
          <a className="rounded-md border border-ply-300 px-4 py-2 text-sm font-semibold" href={`${moneyBase(channelId)}.csv`} download>
            Download as CSV
          </a>
        }
      />
      <QueryState query={query} loading="Loading the channel's money…" page>
        {(money) => <MoneyView channelId={channelId} money={money} />}
      </QueryState>
    </div>
  );
}

const cell = "px-2 py-1.5 text-right tabular-nums";

function MoneyView({ channelId, money }: { channelId: string; money: ChannelMoneyView }) {
  const { currency } = money.settings;
  return (
    <>
      <MoneySettingsForm channelId={channelId} settings={money.settings} />
      <section aria-labelledby="money-months" className="flex flex-col gap-3">
        <h2 id="money-months" className="text-lg font-semibold">
          Margin per month, in {currency}
        </h2>
        {money.months.length === 0 ? (
          <Empty title="No money recorded yet">Record costs and income on an episode's Costs and income part; paid sponsor invoices count here on their own.</Empty>
        ) : (
          <>
            <MarginChart months={money.months} currency={currency} />
            <div className="overflow-x-auto">
              <table className="w-full min-w-0 text-sm">
                <caption className="sr-only">Money in, costs and margin per month in {currency}</caption>
                <thead className="border-b border-ply-300 text-xs text-graphite-500">
                  <tr>
                    <th className="px-2 py-1.5 text-left">Month</th>
                    <th className={cell}>Money in</th>
                    <th className={cell}>Costs</th>
                    <th className={cell}>Margin</th>
                  </tr>
                </thead>
                <tbody>
                  {money.months.map((m) => (
                    <tr key={m.month} className="border-b border-ply-200">
                      <th className="px-2 py-1.5 text-left font-normal">{m.month}</th>
                      <td className={cell}>{formatMinorMoney(m.incomeMinor, currency)}</td>
                      <td className={cell}>{formatMinorMoney(m.costsMinor, currency)}</td>
                      <td className={`${cell} font-semibold ${m.marginMinor < 0 ? "text-alarm-600" : ""}`}>{signedMoney(m.marginMinor, currency)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </>
        )}
      </section>
      {money.episodes.length > 0 && (
        <section aria-labelledby="money-episodes">
          <h2 id="money-episodes" className="mb-2 text-lg font-semibold">
            By episode
          </h2>
          <ul className="flex flex-col gap-2">
            {money.episodes.map((e) => (
              <li key={e.episodeId} className="flex flex-wrap justify-between gap-2 rounded-md border border-ply-300 bg-white p-3 text-sm">
                <Link className="min-w-0 break-words font-semibold underline" to={`/c/${channelId}/episodes/${e.episodeId}/money`}>
                  {e.title}
                </Link>
                <span>
                  in {formatMinorMoney(e.receivedMinor, currency)} · out {formatMinorMoney(e.costsMinor, currency)} · <strong className={e.marginMinor < 0 ? "text-alarm-600" : ""}>{signedMoney(e.marginMinor, currency)}</strong>
                </span>
              </li>
            ))}
          </ul>
        </section>
      )}
    </>
  );
}
