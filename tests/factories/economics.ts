import type { Database } from "../../server/db/client";
import { insertEntry } from "../../server/economics/money.repository";
import type { moneyEntries } from "../../server/db/schema/economics";

/** A purchase on an episode, straight in the database: 12.50 EUR of invented balsa unless told otherwise. */
export async function createEntry(db: Database, channelId: string, episodeId: string, overrides: Partial<typeof moneyEntries.$inferInsert> = {}) {
  return insertEntry(db, {
    channelId,
    episodeId,
    kind: "purchase",
    category: "materials",
    label: "Balsa sheet",
    source: "Timber yard",
    amountMinor: 1250,
    currency: "EUR",
    channelMinor: 1250,
    occurredOn: "2027-03-04",
    ...overrides,
  });
}
