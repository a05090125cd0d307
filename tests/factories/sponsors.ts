import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { shiftDate } from "../../shared/sponsors/dates";
import { generateDeliverables, pairedByTemplate, suggestedTemplateItems, type TemplateItem } from "../../shared/sponsors/deliverables";
import type { DeliverableKind, DeliverableStatus } from "../../shared/sponsors/deliverables";
import type { Database } from "../../server/db/client";
import { dealTemplates, deals, deliverables, sponsorContacts, sponsors } from "../../server/db/schema/sponsors";
import { createEpisode } from "./episodes";

export async function createSponsor(db: Database, channelId: string, overrides: { company?: string; website?: string | null } = {}) {
  const [sponsor] = await db
    .insert(sponsors)
    .values({ channelId, company: overrides.company ?? `Sponsor ${randomUUID().slice(0, 6)}`, website: overrides.website ?? null })
    .returning();
  return sponsor!;
}

export async function createContact(db: Database, channelId: string, sponsorId: string, overrides: { name?: string; email?: string } = {}) {
  const [contact] = await db
    .insert(sponsorContacts)
    .values({ channelId, sponsorId, name: overrides.name ?? "Casey Contact", email: overrides.email ?? `contact-${randomUUID().slice(0, 8)}@example.com`, role: "Partnerships" })
    .returning();
  return contact!;
}

export async function createTemplate(db: Database, channelId: string, items: TemplateItem[] = suggestedTemplateItems, name = "Standard read") {
  const [template] = await db.insert(dealTemplates).values({ channelId, name, items }).returning();
  return template!;
}

interface DealOverrides {
  sponsorId: string;
  contactId?: string | null;
  createdBy?: string | null;
  publishDate?: string | null;
  items?: TemplateItem[];
  ownerId?: string | null;
  statuses?: Partial<Record<number, DeliverableStatus>>;
  fee?: string;
  currency?: string;
  script?: string;
  descriptionCopy?: string | null;
  state?: "negotiating" | "signed" | "live" | "wrapped" | "cancelled";
  segmentSeconds?: number;
  talkingPoints?: string[];
  link?: string | null;
  promoCode?: string | null;
  disclosureText?: string | null;
}

/** A deal with its items dated from the episode's publish date, straight in the database. */
export async function createDeal(db: Database, channelId: string, episodeId: string | null, overrides: DealOverrides) {
  const publishDate = overrides.publishDate ?? null;
  const [deal] = await db
    .insert(deals)
    .values({
      channelId,
      episodeId,
      sponsorId: overrides.sponsorId,
      contactId: overrides.contactId ?? null,
      state: overrides.state ?? "signed",
      placement: "middle",
      segmentSeconds: overrides.segmentSeconds ?? 60,
      talkingPoints: overrides.talkingPoints ?? ["Holds 0.1 mV ripple"],
      link: overrides.link === undefined ? "https://northbeam.example/gantry" : overrides.link,
      promoCode: overrides.promoCode === undefined ? "GANTRY10" : overrides.promoCode,
      disclosureText: overrides.disclosureText ?? null,
      script: overrides.script ?? "",
      descriptionCopy: overrides.descriptionCopy ?? null,
      publishBasis: publishDate,
      feeAmount: overrides.fee ?? "4321.00",
      currency: overrides.currency ?? "EUR",
      paymentTermsDays: 30,
      paymentTermsFrom: "invoice",
      createdBy: overrides.createdBy ?? null,
    })
    .returning();
  const generated = generateDeliverables(overrides.items ?? suggestedTemplateItems, { publishDate, goLiveDate: null });
  const items = generated.length
    ? await db
        .insert(deliverables)
        .values(
          pairedByTemplate(generated, generated.map(() => randomUUID())).map((item, index) => ({
            id: item.id,
            approvesId: item.approvesId,
            channelId,
            dealId: deal!.id,
            kind: item.kind,
            title: item.title,
            anchor: item.anchor,
            offsetDays: item.offsetDays,
            dueDate: item.dueDate,
            position: item.position,
            ownerId: overrides.ownerId ?? null,
            status: overrides.statuses?.[index] ?? "not_started",
          })),
        )
        .returning()
    : [];
  return { deal: deal!, items };
}

/**
 * One hand-dated item owned by a member, due on `dueDate`, on a deal of its own (what a reminder test
 * needs): the episode publishes a month later, so nothing else on the deal is due.
 */
export async function createItemDue(
  db: Database,
  channelId: string,
  input: { ownerId: string; dueDate: string; title: string; company?: string; episodeTitle?: string; kind?: DeliverableKind },
) {
  const publishDate = shiftDate(input.dueDate, 30);
  const episode = await createEpisode(db, channelId, { title: input.episodeTitle ?? `${input.title} episode`, targetPublishDate: publishDate });
  const sponsor = await createSponsor(db, channelId, { company: input.company ?? "Test Sponsor" });
  const made = await createDeal(db, channelId, episode.id, {
    sponsorId: sponsor.id,
    ownerId: input.ownerId,
    publishDate,
    items: [{ kind: input.kind ?? "other", title: input.title, anchor: "before_publish", offsetDays: 0, ownerRole: null }],
  });
  const [item] = await db.update(deliverables).set({ anchor: "fixed", dueDate: input.dueDate }).where(eq(deliverables.id, made.items[0]!.id)).returning();
  return { episode, sponsor, deal: made.deal, item: item! };
}
