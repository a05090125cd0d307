import { describe, expect, it } from "vitest";
import { formatStay, timeInStages } from "./history";

// Check values by plain arithmetic on the instants below (1 h = 3,600,000 ms; 1 d = 24 h).
const H = 3_600_000;

describe("time in each stage, from the history", () => {
  it("when an episode moved forward twice, then each stay runs from one move to the next", () => {
    const times = timeInStages(
      [
        { from: null, to: "challenge", at: "2027-03-01T09:00:00Z" },
        { from: "challenge", to: "test_plan", at: "2027-03-03T09:00:00Z" }, // 2 d after creation
        { from: "test_plan", to: "build", at: "2027-03-03T15:00:00Z" }, // 6 h later
      ],
      new Date("2027-03-04T15:00:00Z"), // build has run 1 d
    );
    const byStage = Object.fromEntries(times.map((t) => [t.stage, t.ms]));
    expect(byStage).toMatchObject({ challenge: 48 * H, test_plan: 6 * H, build: 24 * H, shoot: 0, publish: 0 });
  });

  it("when an episode went back and on again, then both stays in a stage add up", () => {
    const times = timeInStages(
      [
        { from: "test_plan", to: "challenge", at: "2027-03-02T10:00:00Z" }, // out of order on purpose: sorted by time
        { from: null, to: "challenge", at: "2027-03-01T10:00:00Z" },
        { from: "challenge", to: "test_plan", at: "2027-03-01T12:00:00Z" }, // challenge 2 h
        { from: "challenge", to: "test_plan", at: "2027-03-02T13:00:00Z" }, // test plan 22 h, then challenge 3 h
      ],
      new Date("2027-03-02T14:00:00Z"), // test plan again 1 h
    );
    const testPlan = times.find((t) => t.stage === "test_plan")!;
    const challenge = times.find((t) => t.stage === "challenge")!;
    expect(challenge).toEqual({ stage: "challenge", ms: 5 * H, visits: 2 });
    expect(testPlan).toEqual({ stage: "test_plan", ms: 23 * H, visits: 2 });
  });

  it("when a stay is formatted, then days and hours are whole", () => {
    expect(formatStay(30 * 60_000)).toBe("under an hour");
    expect(formatStay(5 * H)).toBe("5 h");
    expect(formatStay(48 * H)).toBe("2 d");
    expect(formatStay(76 * H + 59 * 60_000)).toBe("3 d 4 h");
  });
});
