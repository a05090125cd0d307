import { z } from "zod";
import { stages } from "./stages";

export const episodeSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  question: z.string(),
  stage: z.enum(stages),
  rank: z.string(),
  version: z.number().int(),
  ownerId: z.string().nullable(),
  ownerName: z.string().nullable(),
  targetPublishDate: z.string().nullable(),
  archivedAt: z.string().nullable(),
});
export type EpisodeSummary = z.infer<typeof episodeSummarySchema>;
