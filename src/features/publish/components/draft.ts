import type { PackageInput, PublishPackageView } from "@shared/publish/schemas";
import { instantOfWallTime, wallTimeOf } from "@shared/publish/publish-time";

/** The package as the form holds it: the publish time as the zone's wall clock ("2027-03-05T17:00"). */
export interface Draft {
  titles: string[];
  chosenTitle: number | null;
  description: string;
  chapters: string;
  timeZone: string;
  wallTime: string;
  thumbnailId: string | null;
}

export const draftOf = (pkg: PublishPackageView): Draft => ({
  titles: pkg.titles,
  chosenTitle: pkg.chosenTitle,
  description: pkg.description,
  chapters: pkg.chapters,
  timeZone: pkg.timeZone,
  wallTime: pkg.publishAt ? wallTimeOf(new Date(pkg.publishAt), pkg.timeZone) : "",
  thumbnailId: pkg.thumbnailId,
});

export function inputOf(draft: Draft, version: number): PackageInput {
  const { wallTime, ...rest } = draft;
  return { ...rest, version, publishAt: wallTime ? (instantOfWallTime(wallTime, draft.timeZone)?.toISOString() ?? null) : null };
}
