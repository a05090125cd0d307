import type { DemoContext } from "./channel";

/** The demo channel's slate rows (invented, like everything in the demo). */
export async function seedSlateDemo(_context: DemoContext): Promise<void> {}
