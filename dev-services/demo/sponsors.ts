import { randomUUID } from "node:crypto";
import { addDays, addHours, subDays } from "date-fns";
import { generateDeliverables, pairedByTemplate, suggestedTemplateItems, type DeliverableStatus } from "../../shared/sponsors/deliverables";
import { dealTemplates, deals, deliverableEvents, deliverables, reviewLinks, speakingRates, sponsorContacts, sponsors, sponsorSettings } from "../../server/db/schema/sponsors";
import type { DemoContext } from "./context";

/*
 * The demo channel's sponsors: three invented companies, four deals in different states, one item
 * overdue, one waiting on the sponsor behind an open review link, and approvals already recorded.
 * Every company, person, address, code and figure here is made up (".example" is a reserved domain).
 */

const companies = [
  { key: "copperleaf", company: "Copperleaf Tools", website: "https://copperleaf.example", notes: "Soldering stations and hand tools. Prefers mid-roll reads.", contact: { name: "Maren Solberg", email: "maren.solberg@copperleaf.example", role: "Creator partnerships" } },
  { key: "northbeam", company: "Northbeam Bench Supplies", website: "https://northbeam.example", notes: "Lab power supplies. Wants the ripple figure said on camera.", contact: { name: "Dev Anand Rao", email: "dev.rao@northbeam.example", role: "Marketing lead" } },
  { key: "sunfold", company: "Sunfold Panels", website: "https://sunfold.example", notes: "Folding solar panels; first approach came through the channel's contact form.", contact: { name: "Lucía Ferrand", email: "lucia.ferrand@sunfold.example", role: "Brand manager" } },
] as const;

interface DemoDeal {
  sponsor: (typeof companies)[number]["key"];
  episode: string;
  state: "negotiating" | "signed" | "live" | "wrapped" | "cancelled";
  fee: string;
  currency: string;
  seconds: number;
  points: string[];
  link: string;
  code: string;
  script: string;
  description: string | null;
  /** Status per template position; the rest stay "not started". */
  statuses: Partial<Record<number, DeliverableStatus>>;
}

const demoDeals: DemoDeal[] = [
  {
    sponsor: "copperleaf",
    episode: "Cheap and dear soldering irons, measured",
    state: "signed",
    fee: "1800.00",
    currency: "EUR",
    seconds: 60,
    points: ["Heats a joint in under four seconds", "Two-year warranty", "Free tip set with the code"],
    link: "https://copperleaf.example/gantry",
    code: "GANTRYLANE",
    script:
      "This video is sponsored by Copperleaf Tools. Their station heats a joint in under four seconds, and every one comes with a two-year warranty. Go to copperleaf.example/gantry and use code GANTRYLANE for a free tip set with the code at checkout.",
    description: "Sponsored by Copperleaf Tools: copperleaf.example/gantry (code GANTRYLANE).",
    // script draft done, script approved; the draft cut is overdue; final approval waits on the sponsor.
    statuses: { 0: "done", 1: "approved", 3: "sent" },
  },
  {
    sponsor: "northbeam",
    episode: "Relay calculator",
    state: "signed",
    fee: "2400.00",
    currency: "EUR",
    seconds: 75,
    points: ["Ripple under 1 mV", "Remote control over the network"],
    link: "https://northbeam.example/relays",
    code: "RELAY15",
    script: "Today's bench supply comes from Northbeam. Its ripple stays under 1 mV, which matters when 120 relays all switch at once.",
    description: null,
    // The script came back: the sponsor asked for changes.
    statuses: { 0: "done", 1: "changes_asked" },
  },
  {
    sponsor: "sunfold",
    episode: "Solar-only espresso",
    state: "negotiating",
    fee: "1500.00",
    currency: "USD",
    seconds: 45,
    points: ["Folds to the size of a laptop"],
    link: "https://sunfold.example/espresso",
    code: "SHOTOFSUN",
    script: "",
    description: null,
    statuses: {},
  },
  {
    sponsor: "copperleaf",
    episode: "Two-stage bottle rocket",
    state: "cancelled",
    fee: "900.00",
    currency: "GBP",
    seconds: 30,
    points: [],
    link: "https://copperleaf.example/rockets",
    code: "LIFTOFF",
    script: "",
    description: null,
    statuses: {},
  },
];

export async function seedSponsorsDemo(context: DemoContext): Promise<void> {
  const { db, channelId, today } = context;
  const producer = context.people.get("producer")!;
  const editor = context.people.get("editor")!;
  const owner = context.people.get("owner")!;

  await db.insert(sponsorSettings).values({ channelId, reminderDaysBefore: 2 });
  await db.insert(speakingRates).values({ channelId, userId: owner.id, wordsPerMinute: 155 });
  await db.insert(dealTemplates).values({ channelId, name: "Standard integration", items: suggestedTemplateItems });

  const sponsorIds = new Map<string, { id: string; contactId: string; contactName: string; contactEmail: string }>();
  for (const c of companies) {
    const [sponsor] = await db.insert(sponsors).values({ channelId, company: c.company, website: c.website, notes: c.notes }).returning();
    const [contact] = await db.insert(sponsorContacts).values({ channelId, sponsorId: sponsor!.id, ...c.contact }).returning();
    sponsorIds.set(c.key, { id: sponsor!.id, contactId: contact!.id, contactName: contact!.name, contactEmail: contact!.email });
  }

  for (const plan of demoDeals) {
    const episode = context.episodes.find((e) => e.title === plan.episode);
    if (!episode) continue;
    const sponsor = sponsorIds.get(plan.sponsor)!;
    const [deal] = await db
      .insert(deals)
      .values({
        channelId,
        episodeId: episode.id,
        sponsorId: sponsor.id,
        contactId: sponsor.contactId,
        hostId: owner.id,
        state: plan.state,
        placement: "middle",
        segmentSeconds: plan.seconds,
        talkingPoints: plan.points,
        link: plan.link,
        promoCode: plan.code,
        disclosureText: `This video is sponsored by ${companies.find((c) => c.key === plan.sponsor)!.company}`,
        descriptionCopy: plan.description,
        script: plan.script,
        publishBasis: episode.targetPublishDate,
        feeAmount: plan.fee,
        currency: plan.currency,
        paymentTermsDays: 30,
        paymentTermsFrom: "invoice",
        createdBy: producer.id,
      })
      .returning();
    if (plan.state === "cancelled") continue;

    const generated = generateDeliverables(suggestedTemplateItems, { publishDate: episode.targetPublishDate, goLiveDate: null });
    const items = await db
      .insert(deliverables)
      .values(
        pairedByTemplate(generated, generated.map(() => randomUUID())).map((item) => ({
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
          status: plan.statuses[item.position] ?? ("not_started" as const),
          ownerId: item.ownerRole === "editor" ? editor.id : item.ownerRole === "owner" ? owner.id : producer.id,
        })),
      )
      .returning();

    const created = subDays(today, 24);
    await db.insert(deliverableEvents).values(
      items.map((item) => ({ channelId, deliverableId: item.id, at: created, actorId: producer.id, actorName: producer.name, actorKind: "member" as const, what: "created" as const, toStatus: "not_started", toDate: item.dueDate, note: 'From the template "Standard integration"' })),
    );
    for (const item of items) {
      if (item.status === "done") {
        await db.insert(deliverableEvents).values({ channelId, deliverableId: item.id, at: subDays(today, 12), actorId: producer.id, actorName: producer.name, actorKind: "member", what: "status", fromStatus: "not_started", toStatus: "done" });
      }
      if (item.status === "approved" || item.status === "changes_asked") {
        // The sponsor decided through a review link: the decision is on record under the contact's name.
        const decision = item.status;
        const comment = decision === "approved" ? "Reads well. Approved as written." : "Please name the network remote in the first sentence, not the last.";
        const sentAt = subDays(today, 9);
        const decidedAt = addHours(sentAt, 20);
        await db.insert(reviewLinks).values({
          channelId,
          dealId: deal!.id,
          deliverableId: item.id,
          contactId: sponsor.contactId,
          contactName: sponsor.contactName,
          contactEmail: sponsor.contactEmail,
          sentBy: producer.id,
          sentByName: producer.name,
          sentByEmail: producer.email,
          expiresAt: addDays(sentAt, 7),
          decidedAt,
          decision,
          comment,
          createdAt: sentAt,
        });
        await db.insert(deliverableEvents).values([
          { channelId, deliverableId: item.id, at: sentAt, actorId: producer.id, actorName: producer.name, actorKind: "member", what: "review_sent", fromStatus: "not_started", toStatus: "sent", note: `Review link sent to ${sponsor.contactName} <${sponsor.contactEmail}>` },
          { channelId, deliverableId: item.id, at: decidedAt, actorName: sponsor.contactName, actorKind: "sponsor", what: "review_decision", fromStatus: "sent", toStatus: decision, note: comment },
        ]);
      }
      if (item.status === "sent") {
        // Waiting on the sponsor: an open link, sent yesterday, good for a week.
        const sentAt = subDays(today, 1);
        await db.insert(reviewLinks).values({
          channelId,
          dealId: deal!.id,
          deliverableId: item.id,
          contactId: sponsor.contactId,
          contactName: sponsor.contactName,
          contactEmail: sponsor.contactEmail,
          sentBy: producer.id,
          sentByName: producer.name,
          sentByEmail: producer.email,
          expiresAt: new Date(Math.floor(addDays(sentAt, 7).getTime() / 1000) * 1000),
          createdAt: sentAt,
        });
        await db.insert(deliverableEvents).values({ channelId, deliverableId: item.id, at: sentAt, actorId: producer.id, actorName: producer.name, actorKind: "member", what: "review_sent", fromStatus: "not_started", toStatus: "sent", note: `Review link sent to ${sponsor.contactName} <${sponsor.contactEmail}>` });
      }
    }
  }
}
