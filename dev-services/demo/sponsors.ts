import type { DemoContext } from "./channel";

/** The demo channel's sponsors rows (invented, like everything in the demo). */
export async function seedSponsorsDemo(_context: DemoContext): Promise<void> {}
