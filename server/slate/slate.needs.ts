import { daysBetween, shiftDate } from "../../shared/sponsors/dates";
import { isAtRisk } from "../../shared/slate/flags";
import { stageLabels, stages, stageIndex, type Stage } from "../../shared/slate/stages";
import type { NeedEntry } from "../../shared/home/needs";
import type { Database } from "../db/client";
import { channelPath, type NeedSource, type NeedViewer } from "../seams/home-needs";
import { gateProblems } from "../seams/stage-gates";
import type { SlatePlugs } from "../seams/slate-plugs";
import { buildCards } from "./board-cards";
import { slateStateOf } from "./slate.repository";

/** How far ahead a stage's due date brings its next move's essentials onto the home. */
export const GATE_LOOKAHEAD_DAYS = 7;

/** The part of the episode page where a missing essential is filled in. */
function sectionOf(code: string, stage: Stage): string {
  if (code.startsWith("sponsors.")) return "sponsor-deals";
  if (code.startsWith("test_plan.")) return "test-plan";
  return stage === "build" ? "bench" : "overview";
}

async function activeCards(db: Database, viewer: NeedViewer) {
  const state = await slateStateOf(db, viewer.channelId);
  return buildCards(db, viewer.channelId, state.stageLengths, viewer.timeZone, viewer.today, false);
}

const atRisk: NeedSource = {
  group: "at_risk",
  area: "episodes",
  async needsFor(db, viewer) {
    const cards = await activeCards(db, viewer);
    return cards
      .filter((card) => isAtRisk(card.flags))
      .map((card) => ({
        group: "at_risk",
        key: `at_risk:${card.id}`,
        title: card.title,
        detail: card.flags.filter((flag) => flag.tone === "alarm").map((flag) => flag.detail ?? flag.label).join(" "),
        tone: "alarm",
        episode: { id: card.id, title: card.title },
        href: channelPath(viewer.channelId, `episodes/${card.id}/overview`),
        date: card.stageDue,
      }));
  },
};

/**
 * Episodes whose stage is due within a week (or already due) and whose move to the next stage would
 * stop at a gate: the essentials to fill in before moving on. Only those, so a long slate costs a few
 * gate checks, not one per episode.
 */
function gatesWaiting(plugs: Pick<SlatePlugs, "stageGates">): NeedSource {
  return {
    group: "gate_waiting",
    area: "episodes",
    async needsFor(db, viewer) {
      const horizon = shiftDate(viewer.today, GATE_LOOKAHEAD_DAYS);
      const near = (await activeCards(db, viewer)).filter((card) => card.stage !== "publish" && card.stageDue !== null && card.stageDue <= horizon);
      const found = await Promise.all(
        near.map(async (card): Promise<NeedEntry[]> => {
          const from = card.stage as Stage;
          const to = stages[stageIndex(from) + 1]!;
          const problems = await gateProblems(plugs.stageGates, { db, channelId: viewer.channelId, episodeId: card.id, from, to });
          if (problems.length === 0) return [];
          const days = daysBetween(viewer.today, card.stageDue!);
          const when = days < 0 ? `was due ${-days} day${days === -1 ? "" : "s"} ago` : days === 0 ? "is due today" : `is due in ${days} day${days === 1 ? "" : "s"}`;
          return [
            {
              group: "gate_waiting",
              key: `gate_waiting:${card.id}`,
              title: `${card.title}: before ${stageLabels[to]}`,
              detail: `${stageLabels[from]} ${when}. ${problems.map((problem) => problem.message).join(" ")}`,
              tone: days < 0 ? "alarm" : "warn",
              episode: { id: card.id, title: card.title },
              href: channelPath(viewer.channelId, `episodes/${card.id}/${sectionOf(problems[0]!.code, from)}`),
              date: card.stageDue,
            },
          ];
        }),
      );
      return found.flat();
    },
  };
}

/** The slate's entries on members' homes; the gates are the ones other features plug into the slate. */
export const slateNeeds = (plugs: Pick<SlatePlugs, "stageGates">): NeedSource[] => [atRisk, gatesWaiting(plugs)];
