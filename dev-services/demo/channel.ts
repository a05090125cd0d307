import { addDays, formatISO } from "date-fns";
import { generateNKeysBetween } from "fractional-indexing";
import { sql } from "drizzle-orm";
import type { Role } from "../../shared/access/roles";
import type { Origin } from "../../shared/slate/schemas";
import { stages, type Stage } from "../../shared/slate/stages";
import type { Database } from "../../server/db/client";
import { addMember, createChannel, createUser } from "../../tests/factories/accounts";
import { createEpisode } from "../../tests/factories/episodes";
import { DEMO_TIME_ZONE, type DemoContext } from "./context";
import { seedSlateDemo } from "./slate";
import { seedBenchDemo } from "./bench";
import { seedRushesDemo } from "./rushes";
import { seedSponsorsDemo } from "./sponsors";

/** Each feature's demo rows, in the order they depend on each other. */
const featureDemos = [seedSlateDemo, seedBenchDemo, seedRushesDemo, seedSponsorsDemo];

/** Demo-only sign-ins, printed by `npm start` and listed in the README. Never use them anywhere real. */
export const DEMO_PASSWORD = "kerf-demo-only";

export const demoAccounts: { role: Role; email: string; name: string }[] = [
  { role: "owner", email: "owner@example.com", name: "Noor Halvorsen" },
  { role: "producer", email: "producer@example.com", name: "Teodor Baptiste" },
  { role: "editor", email: "editor@example.com", name: "Ilse Marchetti" },
  { role: "crew", email: "crew@example.com", name: "Kwame Lindqvist" },
];

export const DEMO_CHANNEL = "Gantry Lane Workshop";

// Invented episodes, two or so for each stage; every name and figure here is made up.
type DemoEpisode = {
  stage: Stage;
  title: string;
  question: string;
  owner: Role;
  daysToPublish: number | null;
  tags?: string[];
  origin?: Origin;
  originLink?: string;
  whyWorthIt?: string;
  budget?: [amount: string, currency: string];
};
const demoEpisodes: DemoEpisode[] = [
  { stage: "challenge", title: "Leaf-blower hovercraft", question: "Can two garden leaf blowers carry a 70 kg rider?", owner: "owner", daysToPublish: 75, tags: ["hover", "garden kit"], origin: "viewer", originLink: "https://example.com/comments/leaf-blower-hovercraft", whyWorthIt: "Asked for in the comments more than anything else this year.", budget: ["180", "EUR"] },
  { stage: "challenge", title: "Paper glider from a desk fan", question: "Can a desk fan launch a glider across the workshop?", owner: "producer", daysToPublish: null, tags: ["flying"], origin: "idea" },
  { stage: "test_plan", title: "Case fans versus one big rotor", question: "Do twelve small fans out-lift one large rotor at the same power?", owner: "owner", daysToPublish: 48, tags: ["flying", "batteries"], budget: ["240", "EUR"], whyWorthIt: "Settles the argument under every fan-lift video." },
  { stage: "test_plan", title: "Solar-only espresso", question: "Can a folding solar panel pull a shot before lunch?", owner: "owner", daysToPublish: 60, tags: ["solar", "heat"], origin: "sponsor", budget: ["320", "EUR"] },
  { stage: "build", title: "Drill-motor skateboard", question: "Will two cordless drill motors push a board at 20 km/h?", owner: "owner", daysToPublish: 30, tags: ["batteries", "vehicles"], budget: ["150", "EUR"] },
  { stage: "build", title: "Mousetrap car distance record", question: "How far can one spring carry a car on a smooth floor?", owner: "editor", daysToPublish: 24, tags: ["vehicles"], origin: "viewer", originLink: "https://example.com/comments/mousetrap-record" },
  { stage: "shoot", title: "Thermal camera on a kite", question: "Can a kite hold a camera steady enough to map roof heat loss?", owner: "owner", daysToPublish: 16, tags: ["flying", "heat"], budget: ["90", "EUR"] },
  { stage: "shoot", title: "Two-stage bottle rocket", question: "Does a second stage beat one bigger bottle?", owner: "producer", daysToPublish: 12, tags: ["flying", "rockets"] },
  { stage: "edit", title: "Relay calculator", question: "Can 120 relays add two four-digit numbers?", owner: "editor", daysToPublish: 9, tags: ["electronics"], budget: ["410", "EUR"] },
  { stage: "edit", title: "Levitating water drops", question: "Can sound alone hold a drop of water in the air?", owner: "editor", daysToPublish: 6, tags: ["sound"] },
  { stage: "sponsor_read", title: "Cheap and dear soldering irons, measured", question: "Does a dearer iron heat a joint faster?", owner: "producer", daysToPublish: 4, tags: ["electronics", "heat"], origin: "sponsor" },
  { stage: "publish", title: "How strong are printed hinges?", question: "What load does a printed living hinge take before it tears?", owner: "owner", daysToPublish: 1, tags: ["printing"] },
];

export async function isEmpty(db: Database): Promise<boolean> {
  const result = await db.execute(sql`select count(*)::int as count from users`);
  return (result.rows[0] as { count: number }).count === 0;
}

/** A demo seeded before Kerf confirmed addresses gets its accounts confirmed too (demo addresses only). */
export async function confirmDemoAddresses(db: Database): Promise<void> {
  const emails = [...demoAccounts.map((account) => account.email), "neighbour@example.com"];
  await db.execute(sql`update users set email_verified_at = now() where email_verified_at is null and email in ${emails}`);
}

export async function seedDemo(db: Database, today = new Date()): Promise<void> {
  const people: DemoContext["people"] = new Map();
  const episodes: DemoContext["episodes"] = [];
  for (const account of demoAccounts) {
    // Seeded with confirmed addresses, so the demo can invite people and send review links at once.
    people.set(account.role, await createUser(db, { email: account.email, name: account.name, password: DEMO_PASSWORD, timeZone: DEMO_TIME_ZONE, verified: true }));
  }
  const owner = people.get("owner")!;
  const channel = await createChannel(db, owner, DEMO_CHANNEL);
  for (const account of demoAccounts.filter((a) => a.role !== "owner")) await addMember(db, channel.id, people.get(account.role)!, account.role);

  for (const stage of stages) {
    const list = demoEpisodes.filter((e) => e.stage === stage);
    const ranks = generateNKeysBetween(null, null, list.length);
    for (const [i, episode] of list.entries()) {
      const made = await createEpisode(db, channel.id, {
        stage,
        title: episode.title,
        question: episode.question,
        rank: ranks[i],
        ownerId: people.get(episode.owner)!.id,
        targetPublishDate: episode.daysToPublish === null ? null : formatISO(addDays(today, episode.daysToPublish), { representation: "date" }),
        tags: episode.tags,
        origin: episode.origin,
        originLink: episode.originLink,
        whyWorthIt: episode.whyWorthIt,
        budgetAmount: episode.budget?.[0],
        budgetCurrency: episode.budget?.[1],
      });
      episodes.push({ id: made.id, stage, title: made.title, targetPublishDate: made.targetPublishDate });
    }
  }

  const context: DemoContext = { db, today, channelId: channel.id, people, episodes };
  for (const seedFeature of featureDemos) await seedFeature(context);

  // A second channel, where the demo owner is a producer: shows the channel switcher and keeps
  // one channel's rows out of the other's sight.
  const neighbour = await createUser(db, { email: "neighbour@example.com", name: "Ada Okonkwo", password: DEMO_PASSWORD, verified: true });
  const club = await createChannel(db, neighbour, "Tidewater Robot Club");
  await addMember(db, club.id, owner, "producer");
  await createEpisode(db, club.id, { title: "Beach-cleaning rover", question: "Can a rover sieve sand for bottle caps?", ownerId: neighbour.id });
}
