import type { Stage } from "./stages";

/**
 * The part of the episode page each stage's work happens in, so the page opens where the team is:
 * the question while it is a challenge, the sheet while the test is planned, the runs at the bench,
 * the days and shots on set, the footage in the edit, the deals for the sponsor read, and the
 * publish package once it is being published. Each is a part every role sees.
 */
export const partForStage: Record<Stage, string> = {
  challenge: "overview",
  test_plan: "test-plan",
  build: "bench",
  shoot: "shoot",
  edit: "footage",
  sponsor_read: "sponsor-deals",
  publish: "publish-package",
};
