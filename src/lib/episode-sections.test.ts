import { describe, expect, it } from "vitest";
import { stages } from "@shared/slate/stages";
import { openPart, partFromFragment } from "./episode-sections";

const parts = ["overview", "test-plan", "bench", "build-log", "shoot", "footage", "sponsor-deals", "publish-package", "history", "activity"];

describe("the part the episode page opens on", () => {
  it.each([
    ["challenge", "overview"],
    ["test_plan", "test-plan"],
    ["build", "bench"],
    ["shoot", "shoot"],
    ["edit", "footage"],
    ["sponsor_read", "sponsor-deals"],
    ["publish", "publish-package"],
  ] as const)("in %s, with no part in the address, opens %s", (stage, part) => {
    expect(openPart(stage, undefined, parts)).toBe(part);
  });

  it("has a part for every stage", () => {
    for (const stage of stages) expect(parts).toContain(openPart(stage, undefined, parts));
  });

  it("opens the part the address names, whatever the stage", () => {
    expect(openPart("build", "history", parts)).toBe("history");
    expect(openPart("challenge", "footage", parts)).toBe("footage");
  });

  it("falls back to the stage's part when the named one is not on the page", () => {
    expect(openPart("build", "nonsense", parts)).toBe("bench");
  });

  it("falls back to the first part when the stage's own is not on the page", () => {
    expect(openPart("build", undefined, ["overview", "history"])).toBe("overview");
  });
});

describe("old links with a #fragment", () => {
  it("land on the part of that name, or on its new name", () => {
    expect(partFromFragment("#bench", parts)).toBe("bench");
    expect(partFromFragment("#shoot-footage", parts)).toBe("shoot");
    expect(partFromFragment("#schedule", parts)).toBe("overview");
    expect(partFromFragment("#main", parts)).toBeUndefined();
    expect(partFromFragment("", parts)).toBeUndefined();
  });
});
