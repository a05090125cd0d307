import { queryOptions, useQuery } from "@tanstack/react-query";
import type { InvoiceView } from "@shared/sponsors/invoices";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

/** While an invoice waits for payment, asked again every few seconds: "paid" arrives from the provider, not from this page. */
const WAITING_REFRESH_MS = 3000;

export const invoicesQueryOptions = (channelId: string, dealId: string) =>
  queryOptions({
    queryKey: sponsorKeys.invoices(channelId, dealId),
    queryFn: () => api<{ invoices: InvoiceView[] }>(`${channelBase(channelId)}/deals/${dealId}/invoices`).then((r) => r.invoices),
    refetchInterval: (query) => (query.state.data?.some((invoice) => invoice.status === "open") ? WAITING_REFRESH_MS : false),
  });

export const useInvoices = (channelId: string, dealId: string) => useQuery(invoicesQueryOptions(channelId, dealId));
