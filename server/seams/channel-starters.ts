import type { Database } from "../db/client";

/**
 * What a feature puts in every new channel, inside the transaction that makes it (so a channel never
 * exists half set up). Only server/app.ts lists the starters; the accounts code knows this contract.
 */
export type ChannelStarter = (tx: Database, channelId: string) => Promise<void>;

export interface ChannelStarters {
  channelStarters: readonly ChannelStarter[];
}
