import type { BoardFilters, BoardFlagSource } from "./board-flags";
import type { PublishDateFollower } from "./episode-dates";
import type { StageGate } from "./stage-gates";

/** Everything other features plug into the slate, assembled by server/app.ts and handed to slateRoutes. */
export interface SlatePlugs {
  stageGates: readonly StageGate[];
  boardFlags: readonly BoardFlagSource[];
  boardFilters: BoardFilters;
  publishDateFollowers: readonly PublishDateFollower[];
}
