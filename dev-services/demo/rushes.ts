import type { DemoContext } from "./channel";

/** The demo channel's rushes rows (invented, like everything in the demo). */
export async function seedRushesDemo(_context: DemoContext): Promise<void> {}
