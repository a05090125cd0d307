import type { DemoContext } from "./channel";

/** The demo channel's bench rows (invented, like everything in the demo). */
export async function seedBenchDemo(_context: DemoContext): Promise<void> {}
