import { Link } from "react-router-dom";
import { QueryState } from "../../../components/States";
import { DAY_MS, formatDay, formatDuration, formatMinorMoney } from "../../../lib/format";
import { useOverdueInvoices } from "../api/list-overdue-invoices";

/** Invoices waiting for payment past their terms, on the desk of those who see the money. */
export function OverdueInvoices({ channelId }: { channelId: string }) {
  const overdue = useOverdueInvoices(channelId);
  return (
    <section aria-labelledby="desk-overdue-invoices" className="mb-6">
      <h2 id="desk-overdue-invoices" className="mb-2 font-semibold">
        Invoices past their terms {overdue.data && <span className="text-graphite-500">({overdue.data.length})</span>}
      </h2>
      <QueryState query={overdue} loading="Loading overdue invoices…">
        {(list) =>
          list.length === 0 ? (
            <p className="text-sm text-graphite-500">No invoice is overdue.</p>
          ) : (
            <ul className="divide-y divide-ply-200 rounded-lg border border-alarm-600/40 bg-white">
              {list.map((invoice) => (
                <li key={invoice.id} className="grid gap-1 px-4 py-3 sm:grid-cols-[9rem_1fr_9rem] sm:items-center">
                  <span className="text-sm font-semibold text-alarm-600">
                    Due {formatDay(invoice.dueDate)}
                    <span className="block text-xs font-normal">Late by {formatDuration(invoice.daysLate * DAY_MS, { smallest: "d" })}</span>
                  </span>
                  <span>
                    <Link to={`/c/${channelId}/episodes/${invoice.episodeId}/sponsor-deals`} className="font-medium text-graphite-900 underline decoration-ply-300 hover:decoration-rust-600">
                      {invoice.company}: {invoice.label}
                    </Link>
                    <span className="block text-xs text-graphite-500">
                      {invoice.number ? `No. ${invoice.number} · ` : ""}
                      {invoice.episodeTitle}
                    </span>
                  </span>
                  <span className="text-sm font-semibold">{formatMinorMoney(invoice.amountMinor, invoice.currency)}</span>
                </li>
              ))}
            </ul>
          )
        }
      </QueryState>
    </section>
  );
}
