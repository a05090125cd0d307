import { roleLabels, roles } from "../../shared/access/roles";
import { parseChapters } from "../../shared/publish/chapters";
import type { Credit } from "../../shared/publish/description";
import { publishGateProblems } from "../../shared/publish/gate";
import type { GoLiveInput, PackageInput, PublishPackageView } from "../../shared/publish/schemas";
import { dateInZone } from "../../shared/sponsors/dates";
import type { Queryable } from "../db/client";
import { AppError, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { readPublishFacts } from "../seams/publish-sources";
import { episodeSummary, findPackage, insertPackage, membersByRole, ownerTimeZone, updatePackage, type PackageRow } from "./package.repository";
import type { PublishContext } from "./publish.context";
import { findThumbnail } from "./thumbnails.repository";
import { problemsOf, thumbnailViews } from "./thumbnails.service";

function creditsOf(members: { role: (typeof roles)[number]; name: string }[]): Credit[] {
  return roles.map((role) => ({ role: roleLabels[role], names: members.filter((m) => m.role === role).map((m) => m.name) }));
}

/** The package as saved (or empty, version 0, before its first save), with its drafting parts and its gate. */
export async function packageView(ctx: PublishContext, db: Queryable, channelId: string, episodeId: string): Promise<PublishPackageView> {
  const [row, thumbnails, facts, members, summary, zone] = await Promise.all([
    findPackage(db, channelId, episodeId),
    thumbnailViews(ctx, db, channelId, episodeId),
    readPublishFacts(ctx.sources, db, { channelId, episodeId }),
    membersByRole(db, channelId),
    episodeSummary(db, channelId, episodeId),
    ownerTimeZone(db, channelId),
  ]);
  const titles = row?.titles ?? [];
  const chosenTitle = row?.chosenTitle ?? null;
  const chosenThumbnail = thumbnails.rows.find((t) => t.id === row?.thumbnailId) ?? null;
  const description = row?.description ?? "";
  const chapters = row?.chapters ?? "";
  return {
    version: row?.version ?? 0,
    titles,
    chosenTitle,
    description,
    chapters,
    timeZone: row?.timeZone ?? zone,
    publishAt: row?.publishAt?.toISOString() ?? null,
    thumbnailId: chosenThumbnail?.id ?? null,
    publishedAt: row?.publishedAt?.toISOString() ?? null,
    videoUrl: row?.videoUrl ?? null,
    goLiveReason: row?.goLiveReason ?? null,
    thumbnails: thumbnails.views,
    sources: { summary, mentions: facts.mentions, chapters: parseChapters(chapters).chapters, parts: facts.parts, credits: [...facts.credits, ...creditsOf(members)] },
    marks: facts.marks,
    gate: publishGateProblems({
      chosenTitle: chosenTitle === null ? null : (titles[chosenTitle] ?? null),
      description,
      chapters,
      thumbnailProblems: chosenThumbnail ? problemsOf(chosenThumbnail) : null,
      mentions: facts.mentions,
      openApprovals: facts.openApprovals,
    }),
  };
}

async function saved(db: Queryable, caller: Caller, episodeId: string, input: PackageInput): Promise<PackageRow | null> {
  const { version, ...values } = input;
  const row = { ...values, publishAt: values.publishAt === null ? null : new Date(values.publishAt) };
  if (version === 0) return insertPackage(db, caller.channelId, episodeId, row);
  return updatePackage(db, caller.channelId, episodeId, version, row);
}

/** A save of the whole package against the version its form opened with; 409 with the package as it is now otherwise. */
export async function savePackage(ctx: PublishContext, caller: Caller, episodeId: string, input: PackageInput): Promise<PublishPackageView> {
  return ctx.db.transaction(async (tx) => {
    if (input.thumbnailId && !(await findThumbnail(tx, caller.channelId, episodeId, input.thumbnailId))) {
      throw new AppError("validation_failed", "Some fields need attention.", { thumbnailId: "Choose one of this episode's thumbnails." });
    }
    if (!(await saved(tx, caller, episodeId, input))) throw staleSave("publish package", await packageView(ctx, tx, caller.channelId, episodeId));
    return packageView(ctx, tx, caller.channelId, episodeId);
  });
}

/**
 * The video is out: the time and link are kept, and every feature that counts from go-live follows
 * (sponsor items done, "after go-live" dates set) in the same transaction. Missing essentials ask for a reason.
 */
export async function goLive(ctx: PublishContext, caller: Caller, episodeId: string, input: GoLiveInput): Promise<PublishPackageView> {
  return ctx.db.transaction(async (tx) => {
    const before = await packageView(ctx, tx, caller.channelId, episodeId);
    if (before.gate.length > 0 && !input.reason) {
      throw new AppError("unprocessable", "The package is missing essentials. Give a reason to mark it published anyway.", undefined, { problems: before.gate });
    }
    const publishedAt = input.publishedAt ? new Date(input.publishedAt) : new Date();
    const values = { publishedAt, videoUrl: input.videoUrl, goLiveReason: before.gate.length > 0 ? (input.reason ?? null) : null, goLiveSkipped: before.gate, publishedBy: caller.userId };
    const row =
      before.version === 0
        ? await insertPackage(tx, caller.channelId, episodeId, { ...values, timeZone: before.timeZone })
        : await updatePackage(tx, caller.channelId, episodeId, before.version, values);
    if (!row) throw staleSave("publish package", before);
    const liveOn = dateInZone(publishedAt, row.timeZone);
    for (const follower of ctx.goLiveFollowers) await follower.follow(tx, { channelId: caller.channelId, episodeId, actorId: caller.userId, liveOn, videoUrl: input.videoUrl });
    return packageView(ctx, tx, caller.channelId, episodeId);
  });
}
