/**
 * "What needs me": the entries of a member's home. Each is one thing to do, with the place it is done.
 * Features supply them through server/seams/home-needs.ts; the home shows the groups a role works in.
 */
export const needGroups = ["at_risk", "gate_waiting", "sponsor_item", "unlogged_clip", "cut_review", "shoot_today", "shot_to_get", "hazard_to_check"] as const;
export type NeedGroup = (typeof needGroups)[number];

export const needGroupLabels: Record<NeedGroup, string> = {
  at_risk: "Episodes running late",
  gate_waiting: "Essentials missing before the next stage",
  sponsor_item: "Sponsor items to chase",
  unlogged_clip: "Clips not logged yet",
  cut_review: "Segment cuts due for the sponsor's review",
  shoot_today: "Shoot day",
  shot_to_get: "Shots still to get",
  hazard_to_check: "Hazards to check before power-on",
};

/** Which groups each role's home shows, in this order. The owner is the host. */
export const homeGroupsByRole = {
  owner: ["at_risk", "gate_waiting", "hazard_to_check"],
  producer: ["sponsor_item", "at_risk"],
  editor: ["cut_review", "unlogged_clip"],
  crew: ["shoot_today", "shot_to_get", "hazard_to_check"],
} as const satisfies Record<string, readonly NeedGroup[]>;

export type NeedTone = "alarm" | "warn" | "info";

export interface NeedEntry {
  group: NeedGroup;
  /** Stable per entry, for lists and tests: "<group>:<row id>". */
  key: string;
  title: string;
  /** One sentence: why it needs the member now. */
  detail: string;
  tone: NeedTone;
  episode: { id: string; title: string } | null;
  /** The in-app path where it is done, e.g. "/c/<channel>/episodes/<id>#test-plan". */
  href: string;
  /** The date it is due or happens (YYYY-MM-DD), when it has one. */
  date: string | null;
}

export interface HomeView {
  /** YYYY-MM-DD in the member's time zone. */
  today: string;
  timeZone: string;
  groups: { group: NeedGroup; label: string; entries: NeedEntry[] }[];
}
