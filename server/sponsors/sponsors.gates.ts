import type { StageGate } from "../slate/gates";

/** Sponsor essentials checked when an episode enters publish (filled in by the sponsors feature). */
export const sponsorGates: StageGate[] = [];
