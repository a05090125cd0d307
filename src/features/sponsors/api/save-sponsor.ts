import type { Versioned } from "@shared/http/version";
import type { Contact, SponsorInput, ContactInput, SponsorSummary } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useCreateSponsor = (channelId: string) =>
  useSponsorMutation(channelId, (input: SponsorInput) =>
    api<{ sponsor: SponsorSummary }>(`${channelBase(channelId)}/sponsors`, { method: "POST", body: input }).then((r) => r.sponsor),
  );

export const useUpdateSponsor = (channelId: string, sponsorId: string) =>
  useSponsorMutation(channelId, (input: Versioned<SponsorInput>) => api(`${channelBase(channelId)}/sponsors/${sponsorId}`, { method: "PATCH", body: input }));

export const useAddContact = (channelId: string, sponsorId: string) =>
  useSponsorMutation(channelId, (input: ContactInput) =>
    api<{ contact: Contact }>(`${channelBase(channelId)}/sponsors/${sponsorId}/contacts`, { method: "POST", body: input }).then((r) => r.contact),
  );

export const useRemoveContact = (channelId: string, sponsorId: string) =>
  useSponsorMutation(channelId, (contactId: string) => api(`${channelBase(channelId)}/sponsors/${sponsorId}/contacts/${contactId}`, { method: "DELETE" }));
