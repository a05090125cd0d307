import type { InvoiceView, NewInvoiceInput } from "@shared/sponsors/invoices";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useCreateInvoice = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: NewInvoiceInput) => api<{ invoice: InvoiceView }>(`${channelBase(channelId)}/deals/${dealId}/invoices`, { method: "POST", body: input }).then((r) => r.invoice));
