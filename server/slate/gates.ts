import type { GateProblem } from "../../shared/slate/gates";
import { stageIndex, type Stage } from "../../shared/slate/stages";
import type { Database } from "../db/client";
import { benchGates } from "../bench/bench.gates";
import { sponsorGates } from "../sponsors/sponsors.gates";

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

/** Every feature's gates. A feature adds its own in its <feature>.gates.ts. */
const stageGates: StageGate[] = [...benchGates, ...sponsorGates];

/** True when the move passes `stage` going forward (leaving it, or jumping over it). */
export function leavesStageForward(stage: Stage, from: Stage, to: Stage): boolean {
  return stageIndex(from) <= stageIndex(stage) && stageIndex(to) > stageIndex(stage);
}

/** True when the move reaches `stage` or beyond, coming from before it. */
export function entersStageForward(stage: Stage, from: Stage, to: Stage): boolean {
  return stageIndex(from) < stageIndex(stage) && stageIndex(to) >= stageIndex(stage);
}

/** Backward moves are always allowed; forward ones collect every applicable gate's problems. */
export async function gateProblems(context: GateContext): Promise<GateProblem[]> {
  if (stageIndex(context.to) <= stageIndex(context.from)) return [];
  const applicable = stageGates.filter((gate) => gate.applies(context.from, context.to));
  const results = await Promise.all(applicable.map((gate) => gate.check(context)));
  return results.flat();
}
