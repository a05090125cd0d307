import { z } from "zod";

/**
 * The version of a record as its editor last saw it. Every record two people can edit at once
 * carries one (an episode, a deal, a test plan, a run…); a save sends it beside the fields it
 * changes, and a save against a version someone else has moved on answers 409 with the record as it
 * is now. 0 names a record not saved yet (an episode's empty test plan).
 */
export const versionSchema = z.number({ error: "Send the version you last saw." }).int("Send the version you last saw.").min(0, "Send the version you last saw.").max(2_147_483_647, "Send the version you last saw.");

/** A save's body as the client sends it: the fields, and the version they were made against. */
export type Versioned<T> = T & { version: number };
