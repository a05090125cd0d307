import type { Area } from "@shared/access/roles";

/** The channel's pages in the top bar; each shows only to roles that may read its area. */
export interface NavEntry {
  path: string;
  label: string;
  area: Area;
}

export const channelNav: NavEntry[] = [
  // Every member reads episodes, so every member has a home.
  { path: "home", label: "Home", area: "episodes" },
  { path: "slate", label: "Slate", area: "episodes" },
  { path: "calendar", label: "Calendar", area: "episodes" },
  { path: "intake", label: "Asks", area: "intake" },
  { path: "shelf", label: "Shelf", area: "bench" },
  { path: "rushes", label: "Rushes", area: "footage" },
  { path: "desk", label: "Desk", area: "deliverables" },
  { path: "sponsors", label: "Sponsors", area: "sponsors" },
  { path: "money", label: "Money", area: "money" },
  { path: "members", label: "Members", area: "members" },
];
