import { handSuggestionSchema } from "../../shared/intake/schemas";
import type { Database } from "../db/client";
import type { Caller } from "../http/route-table";
import { parseBody } from "../http/validate";
import { fileSuggestion } from "./grouping";
import { lockChannelGrouping } from "./grouping.repository";

/** A suggestion a member types in: grouped like any other; the asker is the name given, if any. */
export async function addByHand(db: Database, caller: Caller, body: unknown): Promise<{ ideaId: string; joined: boolean }> {
  const input = parseBody(handSuggestionSchema, body);
  return db.transaction(async (tx) => {
    await lockChannelGrouping(tx, caller.channelId);
    const author = input.author || null;
    const personKey = author ? `author:${author.toLowerCase()}` : `hand:${crypto.randomUUID()}`;
    const filed = await fileSuggestion(tx, caller.channelId, { text: input.text, source: "hand", personKey, author, link: input.link || null });
    return { ideaId: filed!.ideaId, joined: filed!.joined };
  });
}
