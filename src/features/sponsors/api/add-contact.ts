import type { Contact, ContactInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useAddContact = (channelId: string, sponsorId: string) =>
  useSponsorMutation(channelId, (input: ContactInput) =>
    api<{ contact: Contact }>(`${channelBase(channelId)}/sponsors/${sponsorId}/contacts`, { method: "POST", body: input }).then((r) => r.contact),
  );
