import { hazardLabel } from "../../shared/bench/hazards";
import type { Stage } from "../../shared/slate/stages";
import type { NeedSource } from "../seams/home-needs";
import { channelPath } from "../seams/home-needs";
import { uncheckedHazards } from "./needs.repository";

/** The stages where something gets powered on: planning the test, building, shooting. */
const POWER_ON_STAGES: readonly Stage[] = ["test_plan", "build", "shoot"];

const hazardsToCheck: NeedSource = {
  group: "hazard_to_check",
  area: "safetyChecks",
  async needsFor(db, viewer) {
    const rows = await uncheckedHazards(db, viewer.channelId, POWER_ON_STAGES);
    return rows.map((row) => ({
      group: "hazard_to_check",
      key: `hazard_to_check:${row.id}`,
      title: hazardLabel(row.kind, row.title),
      detail: `${row.episodeTitle}: not checked yet. Precaution: ${row.mitigation}`,
      tone: "warn",
      episode: { id: row.episodeId, title: row.episodeTitle },
      href: channelPath(viewer.channelId, `episodes/${row.episodeId}/test-plan`),
      date: null,
    }));
  },
};

/** Bench entries on members' homes. */
export const benchNeeds: NeedSource[] = [hazardsToCheck];
