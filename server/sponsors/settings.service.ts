import { roleLabels } from "../../shared/access/roles";
import { DEFAULT_WORDS_PER_MINUTE } from "../../shared/sponsors/read";
import type { SponsorSettings } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { listMembersWithRates, reminderDaysBefore } from "./sponsors.repository";

/** The reminders' lead time and every member's speaking rate (the default where none is set). */
export async function settingsOf(db: Database, channelId: string): Promise<SponsorSettings> {
  const [days, members] = await Promise.all([reminderDaysBefore(db, channelId), listMembersWithRates(db, channelId)]);
  return {
    reminderDaysBefore: days,
    hosts: members.map((m) => ({
      userId: m.userId,
      name: m.name,
      role: roleLabels[m.role],
      wordsPerMinute: m.wordsPerMinute ?? DEFAULT_WORDS_PER_MINUTE,
      isDefault: m.wordsPerMinute === null,
    })),
  };
}
