import type { StageGate } from "../slate/gates";

/** Test-plan essentials checked when an episode leaves the test plan stage (filled in by the bench feature). */
export const benchGates: StageGate[] = [];
