import type { SponsorDetail, SponsorSummary } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { seesFees } from "./deals.service";
import { findSponsor, listSponsorDeals, listSponsors } from "./sponsors.repository";

export const contactOf = (c: { id: string; name: string; email: string; role: string | null }) => ({ id: c.id, name: c.name, email: c.email, role: c.role });

export async function sponsorSummaries(db: Database, channelId: string): Promise<SponsorSummary[]> {
  const rows = await listSponsors(db, channelId);
  return rows.map((r) => ({ id: r.id, company: r.company, website: r.website, notes: r.notes, contacts: r.contacts.map(contactOf), dealCount: r.dealCount }));
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
    deals: deals.map(({ feeAmount, currency, ...deal }) => (seesFees(caller.role) ? { ...deal, money: { fee: Number(feeAmount), currency } } : deal)),
  };
}
