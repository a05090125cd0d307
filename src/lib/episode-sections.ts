import type { ComponentType } from "react";
import type { Role } from "@shared/access/roles";

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
}
