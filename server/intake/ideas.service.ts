import { ideaListQuerySchema, type IdeaSort, type IdeaView, type Judgement, type SuggestionView } from "../../shared/intake/schemas";
import { combine, combinedScore, dimensions } from "../../shared/intake/weighing";
import type { Database, Queryable } from "../db/client";
import { AppError, notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import type { EpisodeMaker } from "../seams/episode-makers";
import { firstWording } from "./grouping";
import { insertIdea } from "./grouping.repository";
import { foldIdea, ideaRows, judgementsOf, lockIdea, moveSuggestion, saveJudgement, setIdea, suggestionIdea, suggestionsOf, type IdeaRow, type JudgementRow } from "./ideas.repository";
import { viewerEpisode } from "./promotion";

export interface IdeasContext {
  db: Database;
  appUrl: string;
  makeEpisode: EpisodeMaker;
}

/** The most ideas one list shows: the top of the chosen order. */
export const LIST_LIMIT = 200;

function toView(row: IdeaRow, judgements: JudgementRow[], me: string): IdeaView {
  const own = judgements.filter((j) => j.ideaId === row.id);
  const combined = combine(own);
  const mine = own.find((j) => j.personId === me);
  return {
    id: row.id,
    wording: row.wording,
    status: row.status,
    declineReason: row.declineReason,
    episodeId: row.episodeId,
    people: row.people,
    suggestions: row.suggestions,
    firstAsked: row.firstAsked.toISOString(),
    lastAsked: row.lastAsked.toISOString(),
    samples: row.samples,
    combined,
    combinedScore: combinedScore(combined),
    judges: own.length,
    mine: mine ? (Object.fromEntries(dimensions.map((d) => [d, mine[d]])) as Judgement) : null,
  };
}

/** Highest first; ideas nobody has judged go after the judged ones; ties by people, then by id. */
function byOrder(sort: IdeaSort) {
  const figure = (idea: IdeaView): number | null => {
    if (sort === "people") return idea.people;
    if (sort === "latest") return Date.parse(idea.lastAsked);
    if (sort === "combined") return idea.combinedScore;
    return idea.combined[sort];
  };
  return (a: IdeaView, b: IdeaView) => {
    const fa = figure(a);
    const fb = figure(b);
    if (fa !== fb) return fa === null ? 1 : fb === null ? -1 : fb - fa;
    return b.people - a.people || a.id.localeCompare(b.id);
  };
}

async function views(db: Queryable, caller: Caller, rows: IdeaRow[]): Promise<IdeaView[]> {
  const judgements = await judgementsOf(db, caller.channelId, rows.map((r) => r.id));
  return rows.map((row) => toView(row, judgements, caller.userId));
}

export async function listIdeas(db: Database, caller: Caller, query: unknown): Promise<{ ideas: IdeaView[]; total: number }> {
  const parsed = ideaListQuerySchema.safeParse(query);
  if (!parsed.success) throw new AppError("validation_failed", parsed.error.issues[0]?.message ?? "Check the list's order.");
  const all = await views(db, caller, await ideaRows(db, caller.channelId, { status: parsed.data.status }));
  return { ideas: all.sort(byOrder(parsed.data.sort)).slice(0, LIST_LIMIT), total: all.length };
}

async function oneIdea(db: Queryable, caller: Caller, ideaId: string): Promise<IdeaView> {
  const [view] = await views(db, caller, await ideaRows(db, caller.channelId, { ids: [ideaId] }));
  if (!view) throw notFound("Idea");
  return view;
}

export async function ideaDetail(db: Queryable, caller: Caller, ideaId: string): Promise<{ idea: IdeaView; suggestions: SuggestionView[] }> {
  const idea = await oneIdea(db, caller, ideaId);
  const rows = await suggestionsOf(db, caller.channelId, ideaId);
  return {
    idea,
    suggestions: rows.map((s) => ({ id: s.id, text: s.text, source: s.source, author: s.author, link: s.link, askedAt: s.askedAt.toISOString(), wantsNews: s.contactId !== null })),
  };
}

async function lockedOpen(tx: Queryable, caller: Caller, ideaId: string) {
  const idea = await lockIdea(tx, caller.channelId, ideaId);
  if (!idea) throw notFound("Idea");
  if (idea.status === "promoted") throw alreadyOnSlate();
  return idea;
}

const alreadyOnSlate = () => new AppError("conflict", "That idea is already on the slate; change the episode instead.");

/** Folds `otherIdeaId` into `ideaId`: its suggestions and judgements move over, and it is gone. */
export async function mergeIdeas(db: Database, caller: Caller, ideaId: string, otherIdeaId: string): Promise<IdeaView> {
  if (ideaId === otherIdeaId.toLowerCase()) throw new AppError("validation_failed", "Pick another idea to fold in.", { otherIdeaId: "Pick another idea to fold in." });
  return db.transaction(async (tx) => {
    // Both locked in id order, so two merges of the same pair in opposite directions cannot deadlock.
    for (const id of [ideaId, otherIdeaId.toLowerCase()].sort()) await lockedOpen(tx, caller, id);
    await foldIdea(tx, caller.channelId, otherIdeaId.toLowerCase(), ideaId);
    return oneIdea(tx, caller, ideaId);
  });
}

/** Takes one suggestion out of its idea into a new idea of its own (grouping joined it wrongly). */
export async function splitSuggestion(db: Database, caller: Caller, suggestionId: string): Promise<IdeaView> {
  return db.transaction(async (tx) => {
    const found = await suggestionIdea(tx, caller.channelId, suggestionId);
    if (!found) throw notFound("Suggestion");
    const idea = await lockIdea(tx, caller.channelId, found.ideaId);
    // Read again once the idea is held (or found gone): a split or merge that held it first may have moved the suggestion.
    const now = await suggestionIdea(tx, caller.channelId, suggestionId);
    if (!now) throw notFound("Suggestion");
    if (now.ideaId !== found.ideaId || !idea) throw new AppError("conflict", "That suggestion was just moved to another idea; look again and split it from there.");
    if (idea.status === "promoted") throw alreadyOnSlate();
    const rows = await suggestionsOf(tx, caller.channelId, found.ideaId);
    if (rows.length < 2) throw new AppError("conflict", "That is the idea's only suggestion: there is nothing to split it from.");
    const newId = await insertIdea(tx, caller.channelId, firstWording(found.text));
    await moveSuggestion(tx, caller.channelId, suggestionId, newId);
    return oneIdea(tx, caller, newId);
  });
}

export async function judgeIdea(db: Database, caller: Caller, ideaId: string, judgement: Judgement): Promise<IdeaView> {
  return db.transaction(async (tx) => {
    await saveJudgement(tx, caller.channelId, ideaId, caller.userId, judgement);
    return oneIdea(tx, caller, ideaId);
  });
}

type Decision = { status: "declined"; reason: string } | { status: "parked" } | { status: "open" } | { wording: string };

export async function decideIdea(db: Database, caller: Caller, ideaId: string, decision: Decision): Promise<IdeaView> {
  return db.transaction(async (tx) => {
    await lockedOpen(tx, caller, ideaId);
    if ("wording" in decision) await setIdea(tx, caller.channelId, ideaId, { wording: decision.wording });
    else await setIdea(tx, caller.channelId, ideaId, { status: decision.status, declineReason: decision.status === "declined" ? decision.reason : null });
    return oneIdea(tx, caller, ideaId);
  });
}

/** The idea becomes an episode in the challenge stage carrying its wording, origin, links and askers. */
export async function promoteIdea(ctx: IdeasContext, caller: Caller, ideaId: string): Promise<{ idea: IdeaView; episodeId: string }> {
  // Drizzle's own transaction: the episode's insert opens a transaction of its own, a savepoint inside this one.
  return ctx.db.transaction(async (tx) => {
    await lockedOpen(tx, caller, ideaId);
    const { idea, suggestions } = await ideaDetail(tx, caller, ideaId);
    const episode = await ctx.makeEpisode(tx, caller, viewerEpisode(idea, suggestions, `${ctx.appUrl}/c/${caller.channelId}/intake/${ideaId}`));
    await setIdea(tx, caller.channelId, ideaId, { status: "promoted", episodeId: episode.id });
    return { idea: await oneIdea(tx, caller, ideaId), episodeId: episode.id };
  });
}
