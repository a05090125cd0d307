/**
 * Who may do what, by area. This is the spec's role table in code: the server's
 * route table and the client's menus both read it, so they cannot disagree.
 */
export const roles = ["owner", "producer", "editor", "crew"] as const;
export type Role = (typeof roles)[number];

export const areas = [
  "members",
  "episodes",
  "comments",
  "testPlan",
  "safetyChecks",
  "bench",
  "shoot",
  "footage",
  "footageRemoval",
  "sponsors",
  "fees",
  "deliverables",
  "cut",
  "publish",
  "money",
  "intake",
  "intakePage",
] as const;
export type Area = (typeof areas)[number];

/** R read, W create and change, "-" nothing. */
export type Grant = "R" | "W" | "-";

export const grants: Record<Area, Record<Role, Grant>> = {
  members: { owner: "W", producer: "R", editor: "-", crew: "-" },
  episodes: { owner: "W", producer: "W", editor: "W", crew: "R" },
  comments: { owner: "W", producer: "W", editor: "W", crew: "W" },
  testPlan: { owner: "W", producer: "W", editor: "R", crew: "R" },
  // Checking a listed hazard at power-on: crew stand at the bench then (the spec's "safety checks" row),
  // though listing hazards and their precautions stays with the test plan.
  safetyChecks: { owner: "W", producer: "W", editor: "R", crew: "W" },
  bench: { owner: "W", producer: "W", editor: "R", crew: "W" },
  shoot: { owner: "W", producer: "W", editor: "W", crew: "W" },
  // Crew upload and log footage; deleting it is the other roles' (the spec: "upload and log; no delete").
  footage: { owner: "W", producer: "W", editor: "W", crew: "W" },
  footageRemoval: { owner: "W", producer: "W", editor: "W", crew: "-" },
  sponsors: { owner: "W", producer: "W", editor: "R", crew: "R" },
  fees: { owner: "W", producer: "W", editor: "-", crew: "-" },
  deliverables: { owner: "W", producer: "W", editor: "R", crew: "R" },
  // The cut of a deal's segment: the editor delivers it (the spec: deliverables "W on the cut items they
  // deliver"), so they set the deal's cut and move the cut items along; everyone with deliverables W may too.
  cut: { owner: "W", producer: "W", editor: "W", crew: "R" },
  publish: { owner: "W", producer: "W", editor: "W", crew: "R" },
  // Costs and income of episodes, margins, the channel's currency and hourly rate.
  money: { owner: "W", producer: "W", editor: "-", crew: "-" },
  // Viewers' suggestions: any member enters, groups and weighs them (issue 17: "entry by hand by any member").
  intake: { owner: "W", producer: "W", editor: "W", crew: "W" },
  // The public suggestion page (on or off, its prompt) and the CSV column mapping speak for the channel.
  intakePage: { owner: "W", producer: "W", editor: "R", crew: "R" },
};

export type Need = "R" | "W";

export function roleMay(role: Role, area: Area, need: Need): boolean {
  const grant = grants[area][role];
  if (grant === "W") return true;
  return grant === "R" && need === "R";
}

export function rolesAllowed(area: Area, need: Need): Role[] {
  return roles.filter((role) => roleMay(role, area, need));
}

export const roleLabels: Record<Role, string> = {
  owner: "Owner",
  producer: "Producer",
  editor: "Editor",
  crew: "Crew",
};
