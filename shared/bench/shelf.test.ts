import { describe, expect, it } from "vitest";
import type { PartKind } from "./schemas";
import { searchShelf, sortShelf } from "./shelf";

const part = (id: string, name: string, kind: PartKind, mass: { value: number; unit: string } | null, supplier = "") => ({ id, name, kind, mass, supplier });

const shelf = [
  part("a", "Prop 5x4.3", "propeller", { value: 4.2, unit: "g" }),
  part("b", "Motor 2306", "motor", { value: 1.2, unit: "oz" }, "Hobbywerk"),
  part("c", "Pack 4S 1500", "battery", { value: 0.185, unit: "kg" }),
  part("d", "Frame Alu", "frame", null),
  part("e", "Ducted fan 64", "fan", { value: 0.25, unit: "lb" }, "Café Parts"),
];

describe("sorting the shelf", () => {
  it("sorts by mass across units, the unweighed last", () => {
    // 1 oz = 28.349523125 g and 1 lb = 453.59237 g (NIST SP 811 (2008), Appendix B.8):
    // 1.2 oz = 34.02 g, 0.25 lb = 113.4 g, 0.185 kg = 185 g.
    expect(sortShelf(shelf, "mass").map((p) => p.id)).toEqual(["a", "b", "e", "c", "d"]);
  });

  it("sorts by name and by kind (then name)", () => {
    expect(sortShelf(shelf, "name").map((p) => p.id)).toEqual(["e", "d", "b", "c", "a"]);
    // Kind labels in alphabetical order: Battery pack, Fan, Frame, Motor, Propeller.
    expect(sortShelf(shelf, "kind").map((p) => p.id)).toEqual(["c", "e", "d", "b", "a"]);
  });
});

describe("searching the shelf", () => {
  it("matches every word in the name, kind or supplier, ignoring case and accents", () => {
    expect(searchShelf(shelf, "MOTOR").map((p) => p.id)).toEqual(["b"]);
    expect(searchShelf(shelf, "cafe").map((p) => p.id)).toEqual(["e"]);
    expect(searchShelf(shelf, "pack 4s").map((p) => p.id)).toEqual(["c"]);
    expect(searchShelf(shelf, "  ").map((p) => p.id)).toHaveLength(5);
    expect(searchShelf(shelf, "servo")).toEqual([]);
  });
});
