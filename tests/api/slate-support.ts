import { expect } from "vitest";
import type { Board, BoardCard, EpisodeFields, EpisodeRecord } from "../../shared/slate/schemas";
import type { Stage } from "../../shared/slate/stages";
import type { Visitor } from "../support/test-app";

export const fields = (overrides: Partial<EpisodeFields> = {}): EpisodeFields => ({
  title: "Bottle-rocket parachute",
  question: "Does a parachute from a bin bag bring the rocket down intact?",
  origin: "idea",
  originLink: "",
  whyWorthIt: "Viewers keep asking what happens after the launch.",
  ownerId: "",
  tags: ["rockets"],
  budgetAmount: "",
  budgetCurrency: "",
  targetPublishDate: "",
  ...overrides,
});

export async function newEpisode(agent: Visitor, channelId: string, overrides: Partial<EpisodeFields> = {}): Promise<EpisodeRecord> {
  const response = await agent.send("post", `/api/channels/${channelId}/episodes`, fields(overrides));
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.episode;
}

export async function board(agent: Visitor, channelId: string, query = ""): Promise<Board> {
  const response = await agent.get(`/api/channels/${channelId}/episodes${query}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body;
}

/** Titles of one column, top to bottom. */
export const column = (b: Board, stage: Stage) => b.episodes.filter((e) => e.stage === stage).map((e) => e.title);

export const cardOf = (b: Board, id: string): BoardCard => {
  const card = b.episodes.find((e) => e.id === id);
  if (!card) throw new Error(`no card ${id} on the board`);
  return card;
};

export function moveTo(agent: Visitor, channelId: string, episode: { id: string; version: number }, body: { stage: Stage; afterId?: string | null; beforeId?: string | null; reason?: string }) {
  return agent.send("post", `/api/channels/${channelId}/episodes/${episode.id}/move`, { version: episode.version, ...body });
}
