import { describe, expect, it } from "vitest";
import { criterionSchema } from "./criteria";
import { runsCsv } from "./runs-csv";
import type { CriterionView, RunView } from "./schemas";
import { evaluateRun } from "./runs";

const q = (value: number, unit: string) => ({ value, unit });

describe("CSV export of the runs", () => {
  const criteria: CriterionView[] = [
    { id: "c1", position: 1, version: 1, ...criterionSchema.parse({ metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W"), required: true }) },
  ];
  const plan = { airframeMass: q(420, "g"), criteria: criteria.map((c) => ({ id: c.id, criterion: c })) };
  const view = (number: number, label: string, notes: string, measurements: RunView["measurements"], supply: RunView["supply"]): RunView => {
    const parts = [{ partId: "p1", name: 'Tarn 2216, "880 kV"', kind: "motor" as const, powered: true, count: 1, mass: q(68, "g"), ratedVoltage: q(16.8, "V") }];
    return { id: `r${number}`, episodeId: "e", number, label, parts, supply, measurements, notes, evaluation: evaluateRun({ supply, measurements, parts }, plan), createdAt: "", updatedAt: "", version: 1 };
  };

  it("writes CRLF records, quotes fields with commas, quotes or line breaks, and doubles inner quotes (RFC 4180, section 2)", () => {
    const csv = runsCsv([view(1, "Motor B, 3S", "first spin\nfine", { voltage: q(11.1, "V"), current: q(9800, "mA"), thrust: q(760, "gf") }, { kind: "lipo", cells: 3 })], criteria);
    const records = csv.split("\r\n");
    expect(records.at(-1)).toBe("");
    expect(records[0]).toBe(
      "run,configuration,parts,supply,Mass (g),Voltage (V),Current (A),Electrical power (W),Thrust (gf),Thrust per watt (gf/W),Power per gram (W/g),Thrust-to-weight,Run time (s),Speed (m/s),highest supply voltage (V),over-rated,criterion 1: Thrust per watt ≥ 5 gf/W (required),verdict,notes",
    );
    // Own derivations: 11.1 V × 9.8 A = 108.78 W; 760 / 108.78 = 6.98657841515 gf/W (12 significant figures);
    // 108.78 W / 68 g = 1.59970588235 W/g; 760 gf / (420 + 68) g = 1.55737704918; 3S full = 12.6 V (common practice).
    expect(csv).toContain(
      '1,"Motor B, 3S","1 × Tarn 2216, ""880 kV""","3S LiPo (11.1 V nominal, 12.6 V full)",68,11.1,9.8,108.78,760,6.98657841515,1.59970588235,1.55737704918,,,12.6,no,pass,pass,"first spin\nfine"\r\n',
    );
  });

  it("defuses text a spreadsheet would run as a formula (OWASP CSV Injection, common practice)", () => {
    const csv = runsCsv([view(2, "=HYPERLINK(\"x\")", "+1 more", {}, null)], criteria);
    expect(csv).toContain(`2,"'=HYPERLINK(""x"")"`);
    expect(csv).toContain(",'+1 more\r\n");
  });

  it("leaves unmeasured figures empty and says when the run is over-rated", () => {
    // Common practice: a 5S pack is 21 V full (5 × 4.2 V), above the motor's 16.8 V rating.
    const csv = runsCsv([view(3, "Overvolt", "", { voltage: q(20, "V") }, { kind: "lipo", cells: 5 })], criteria);
    const row = csv.split("\r\n")[1]!;
    expect(row).toContain(",68,20,,,,,,,,,21,yes,not measured,incomplete,");
  });
});
