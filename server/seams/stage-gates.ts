import type { GateProblem } from "../../shared/slate/gates";
import { stageIndex, type Stage } from "../../shared/slate/stages";
import type { Database } from "../db/client";

/**
 * The stage-gate seam: a feature with essentials for a stage move exports its `StageGate`s from its
 * `<feature>.gates.ts`; server/app.ts lists them and hands the list to the slate, which runs them on
 * every forward move. Nothing here knows any feature.
 */
export interface GateContext {
  db: Database;
  channelId: string;
  episodeId: string;
  from: Stage;
  to: Stage;
}

/** One check a feature plugs into stage moves. `applies` says which moves it looks at. */
export interface StageGate {
  name: string;
  applies(from: Stage, to: Stage): boolean;
  check(context: GateContext): Promise<GateProblem[]>;
}

/** True when the move passes `stage` going forward (leaving it, or jumping over it). */
export function leavesStageForward(stage: Stage, from: Stage, to: Stage): boolean {
  return stageIndex(from) <= stageIndex(stage) && stageIndex(to) > stageIndex(stage);
}

/** True when the move reaches `stage` or beyond, coming from before it. */
export function entersStageForward(stage: Stage, from: Stage, to: Stage): boolean {
  return stageIndex(from) < stageIndex(stage) && stageIndex(to) >= stageIndex(stage);
}

/** Backward moves are always allowed; forward ones collect every applicable gate's problems. */
export async function gateProblems(gates: readonly StageGate[], context: GateContext): Promise<GateProblem[]> {
  if (stageIndex(context.to) <= stageIndex(context.from)) return [];
  const applicable = gates.filter((gate) => gate.applies(context.from, context.to));
  const results = await Promise.all(applicable.map((gate) => gate.check(context)));
  return results.flat();
}
