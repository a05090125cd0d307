export const stages = ["challenge", "test_plan", "build", "shoot", "edit", "sponsor_read", "publish"] as const;
export type Stage = (typeof stages)[number];

export const stageLabels: Record<Stage, string> = {
  challenge: "Challenge",
  test_plan: "Test plan",
  build: "Build",
  shoot: "Shoot",
  edit: "Edit",
  sponsor_read: "Sponsor read",
  publish: "Publish",
};

export function stageIndex(stage: Stage): number {
  return stages.indexOf(stage);
}
