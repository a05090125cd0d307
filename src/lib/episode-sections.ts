import type { QueryClient } from "@tanstack/react-query";
import type { ComponentType } from "react";
import type { Area, Role } from "@shared/access/roles";
import { partForStage } from "@shared/slate/episode-parts";
import type { Stage } from "@shared/slate/stages";

/** What every section of the episode page receives. */
export interface EpisodeSectionProps {
  channelId: string;
  episodeId: string;
  role: Role;
}

/** A feature's part of the episode page; src/app/episode-sections.tsx lists them in order. */
export interface EpisodeSection {
  id: string;
  title: string;
  Component: ComponentType<EpisodeSectionProps>;
  /** Shown only to roles that may read this area; every member sees a part without one. */
  area?: Area;
  /** Starts fetching the part's code, when it is fetched on first opening (a `lazy` component). */
  preload?: () => Promise<unknown>;
  /** Starts fetching the part's first answers, so they come alongside its code rather than after it. */
  prefetch?: (client: QueryClient, ids: { channelId: string; episodeId: string }) => void;
}

/** The part to open: the one the address names if the page has it, else the stage's own, else the first. */
export function openPart(stage: Stage, named: string | undefined, parts: readonly string[]): string {
  if (named && parts.includes(named)) return named;
  const own = partForStage[stage];
  return parts.includes(own) ? own : (parts[0] ?? own);
}

/** Old links pointed at a section with a #fragment; the names they used, and what each part is now. */
const renamedParts: Record<string, string> = { "shoot-footage": "shoot", schedule: "overview", activity: "comments" };

/** The part an old `#fragment` link meant, if it names one of the page's parts. */
export function partFromFragment(hash: string, parts: readonly string[]): string | undefined {
  const name = hash.replace(/^#/, "");
  const part = renamedParts[name] ?? name;
  return parts.includes(part) ? part : undefined;
}
