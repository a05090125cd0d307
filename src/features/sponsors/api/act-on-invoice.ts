import type { InvoiceAction, InvoiceView } from "@shared/sponsors/invoices";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useInvoiceAction = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, ({ invoiceId, action }: { invoiceId: string; action: InvoiceAction }) =>
    api<{ invoice: InvoiceView }>(`${channelBase(channelId)}/deals/${dealId}/invoices/${invoiceId}/${action}`, { method: "POST" }).then((r) => r.invoice),
  );
