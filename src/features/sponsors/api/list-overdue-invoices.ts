import { queryOptions, useQuery } from "@tanstack/react-query";
import type { OverdueInvoice } from "@shared/sponsors/invoices";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const overdueInvoicesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: sponsorKeys.overdueInvoices(channelId),
    queryFn: () => api<{ invoices: OverdueInvoice[] }>(`${channelBase(channelId)}/invoices/overdue`).then((r) => r.invoices),
  });

export const useOverdueInvoices = (channelId: string) => useQuery(overdueInvoicesQueryOptions(channelId));
