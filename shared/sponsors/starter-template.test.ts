import { describe, expect, it } from "vitest";
import { templateInputSchema } from "./schemas";
import { starterTemplate } from "./starter-template";

describe("the template every channel starts with", () => {
  it("is a template the channel could have saved itself", () => {
    expect(templateInputSchema.safeParse(starterTemplate).success).toBe(true);
  });

  it("pairs each approval with the item it approves", () => {
    const approvals = starterTemplate.items.filter((item) => item.approves !== undefined);
    expect(approvals.map((item) => starterTemplate.items[item.approves!]?.kind)).toEqual(["script_draft", "draft_cut"]);
  });
});
