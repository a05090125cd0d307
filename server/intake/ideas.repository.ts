import { and, eq, sql } from "drizzle-orm";
import type { IdeaStatus, IdeaView, Judgement } from "../../shared/intake/schemas";
import type { Queryable } from "../db/client";
import { intakeIdeas, intakeJudgements, intakeSuggestions } from "../db/schema/intake";

export interface IdeaRow extends Pick<IdeaView, "id" | "wording" | "status" | "declineReason" | "episodeId" | "people" | "suggestions" | "samples"> {
  firstAsked: Date;
  lastAsked: Date;
}

export interface JudgementRow extends Judgement {
  ideaId: string;
  personId: string;
}

const SAMPLES = 3;

/** Ideas with their askers counted: one status, or the ids given. */
export async function ideaRows(db: Queryable, channelId: string, where: { status: IdeaStatus } | { ids: string[] }): Promise<IdeaRow[]> {
  const filter = "status" in where ? sql`i.status = ${where.status}` : sql`i.id = any(${sql.param(where.ids)}::uuid[])`;
  const found = await db.execute<Record<string, unknown>>(sql`
    select i.id, i.wording, i.status, i.decline_reason, i.episode_id,
      count(distinct s.person_key)::int as people, count(s.id)::int as suggestions,
      min(s.asked_at) as first_asked, max(s.asked_at) as last_asked,
      (array_agg(s.text order by s.asked_at desc))[1:${SAMPLES}] as samples
    from ${intakeIdeas} i join ${intakeSuggestions} s on s.idea_id = i.id
    where i.channel_id = ${channelId} and ${filter}
    group by i.id`);
  return found.rows.map((r) => ({
    id: r.id as string,
    wording: r.wording as string,
    status: r.status as IdeaStatus,
    declineReason: (r.decline_reason as string | null) ?? null,
    episodeId: (r.episode_id as string | null) ?? null,
    people: r.people as number,
    suggestions: r.suggestions as number,
    firstAsked: new Date(r.first_asked as string),
    lastAsked: new Date(r.last_asked as string),
    samples: r.samples as string[],
  }));
}

export async function judgementsOf(db: Queryable, channelId: string, ideaIds: string[]): Promise<JudgementRow[]> {
  if (ideaIds.length === 0) return [];
  return db
    .select({ ideaId: intakeJudgements.ideaId, personId: intakeJudgements.personId, draw: intakeJudgements.draw, reach: intakeJudgements.reach, spend: intakeJudgements.spend, danger: intakeJudgements.danger })
    .from(intakeJudgements)
    .where(and(eq(intakeJudgements.channelId, channelId), sql`${intakeJudgements.ideaId} = any(${sql.param(ideaIds)}::uuid[])`));
}

export async function suggestionsOf(db: Queryable, channelId: string, ideaId: string) {
  return db
    .select({
      id: intakeSuggestions.id,
      text: intakeSuggestions.text,
      source: intakeSuggestions.source,
      author: intakeSuggestions.author,
      link: intakeSuggestions.link,
      askedAt: intakeSuggestions.askedAt,
      contactId: intakeSuggestions.contactId,
    })
    .from(intakeSuggestions)
    .where(and(eq(intakeSuggestions.channelId, channelId), eq(intakeSuggestions.ideaId, ideaId)))
    .orderBy(intakeSuggestions.askedAt);
}

/** The idea, locked for the rest of the transaction (a merge, a split or a promotion of it waits). */
export async function lockIdea(tx: Queryable, channelId: string, ideaId: string) {
  const found = await tx.execute<{ id: string; status: IdeaStatus; wording: string }>(
    sql`select id, status, wording from ${intakeIdeas} where id = ${ideaId} and channel_id = ${channelId} for update`,
  );
  return found.rows[0] ?? null;
}

export async function setIdea(tx: Queryable, channelId: string, ideaId: string, values: Partial<{ status: IdeaStatus; declineReason: string | null; episodeId: string | null; wording: string }>) {
  await tx
    .update(intakeIdeas)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(intakeIdeas.id, ideaId), eq(intakeIdeas.channelId, channelId)));
}

/** Moves every suggestion and judgement of `fromId` to `intoId`, then deletes `fromId`. A member who judged both keeps the kept idea's judgement. */
export async function foldIdea(tx: Queryable, channelId: string, fromId: string, intoId: string): Promise<void> {
  await tx.update(intakeSuggestions).set({ ideaId: intoId }).where(and(eq(intakeSuggestions.channelId, channelId), eq(intakeSuggestions.ideaId, fromId)));
  await tx.execute(sql`
    insert into ${intakeJudgements} (idea_id, person_id, channel_id, draw, reach, spend, danger)
    select ${intoId}, person_id, channel_id, draw, reach, spend, danger from ${intakeJudgements} where idea_id = ${fromId}
    on conflict do nothing`);
  await tx.delete(intakeIdeas).where(and(eq(intakeIdeas.id, fromId), eq(intakeIdeas.channelId, channelId)));
}

export async function suggestionIdea(tx: Queryable, channelId: string, suggestionId: string) {
  const [row] = await tx
    .select({ ideaId: intakeSuggestions.ideaId, text: intakeSuggestions.text })
    .from(intakeSuggestions)
    .where(and(eq(intakeSuggestions.id, suggestionId), eq(intakeSuggestions.channelId, channelId)));
  return row ?? null;
}

export async function moveSuggestion(tx: Queryable, channelId: string, suggestionId: string, ideaId: string): Promise<void> {
  await tx.update(intakeSuggestions).set({ ideaId }).where(and(eq(intakeSuggestions.id, suggestionId), eq(intakeSuggestions.channelId, channelId)));
}

export async function saveJudgement(tx: Queryable, channelId: string, ideaId: string, personId: string, j: Judgement): Promise<void> {
  await tx
    .insert(intakeJudgements)
    .values({ channelId, ideaId, personId, ...j })
    .onConflictDoUpdate({ target: [intakeJudgements.ideaId, intakeJudgements.personId], set: { ...j, updatedAt: new Date() } });
}
