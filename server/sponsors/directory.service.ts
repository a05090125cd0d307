import type { z } from "zod";
import type { Contact, SponsorDetail, SponsorSummary, contactInputSchema, sponsorInputSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { seesFees } from "./deals.service";
import { findSponsor, listOpenEpisodes, listSponsorDeals, listSponsors, updateContact, updateSponsor } from "./sponsors.repository";

export const contactOf = (c: Contact): Contact => ({ id: c.id, name: c.name, email: c.email, role: c.role, version: c.version });

export async function sponsorSummaries(db: Database, channelId: string): Promise<SponsorSummary[]> {
  const rows = await listSponsors(db, channelId);
  return rows.map((r) => ({ id: r.id, company: r.company, website: r.website, notes: r.notes, contacts: r.contacts.map(contactOf), dealCount: r.dealCount, version: r.version }));
}

/** A sponsor with its contacts and deals; the fee travels only to roles that may see it. */
export async function sponsorDetail(db: Database, caller: Caller, sponsorId: string): Promise<SponsorDetail> {
  const sponsor = await findSponsor(db, caller.channelId, sponsorId);
  if (!sponsor) throw notFound("Sponsor");
  const deals = await listSponsorDeals(db, caller.channelId, sponsor.id);
  return {
    id: sponsor.id,
    company: sponsor.company,
    website: sponsor.website,
    notes: sponsor.notes,
    contacts: sponsor.contacts.map(contactOf),
    dealCount: deals.length,
    version: sponsor.version,
    deals: deals.map(({ feeAmount, currency, ...deal }) => (seesFees(caller.role) ? { ...deal, money: { fee: Number(feeAmount), currency } } : deal)),
    episodes: await listOpenEpisodes(db, caller.channelId),
  };
}

type Saved<T> = T extends z.ZodType ? z.output<T> : never;

/** The company's own fields, against the version the editor saw; the answer is the sponsor as its page shows it. */
export async function changeSponsor(db: Database, caller: Caller, sponsorId: string, version: number, input: Saved<typeof sponsorInputSchema>) {
  const row = await updateSponsor(db, caller.channelId, sponsorId, version, input);
  const now = await sponsorDetail(db, caller, sponsorId);
  if (!row) throw staleSave("sponsor", now);
  return now;
}

/** A contact, against the version the editor saw. */
export async function changeContact(db: Database, caller: Caller, sponsorId: string, contactId: string, version: number, input: Saved<typeof contactInputSchema>) {
  const row = await updateContact(db, caller.channelId, sponsorId, contactId, version, input);
  if (row) return contactOf(row);
  const current = (await findSponsor(db, caller.channelId, sponsorId))?.contacts.find((c) => c.id === contactId);
  throw current ? staleSave("contact", contactOf(current)) : notFound("Contact");
}
