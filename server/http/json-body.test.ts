import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { jsonDepth } from "./json-body";
import { pathOfNul } from "./validate";

const bytes = (text: string) => new TextEncoder().encode(text);

/** Depth as JSON.parse sees it, counted on the parsed value (the reference the scan must agree with). */
function parsedDepth(value: unknown): number {
  if (typeof value !== "object" || value === null) return 0;
  const inner = Object.values(value).map(parsedDepth);
  return 1 + Math.max(0, ...inner);
}

describe("jsonDepth", () => {
  it("when JSON texts are generated, then the byte scan agrees with the parsed value's depth", () => {
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 12 }), (value) => {
        const text = JSON.stringify(value);
        expect(jsonDepth(bytes(text))).toBe(parsedDepth(JSON.parse(text)));
      }),
      { numRuns: 500 },
    );
  });

  it("when brackets, quotes and backslashes sit inside strings, then they are not counted", () => {
    expect(jsonDepth(bytes(JSON.stringify({ a: '[[{{"\\\\"]]}}', b: ["\\", '"['] })))).toBe(2);
    expect(jsonDepth(bytes(JSON.stringify("[[[[")))).toBe(0);
    expect(jsonDepth(bytes(JSON.stringify({ "k[[": "é☃👩🏽‍🔧[[" })))).toBe(1);
  });

  it("when a text is far deeper than the cap, then the scan stops just past it", () => {
    const deep = bytes("[".repeat(1_000_000));
    expect(jsonDepth(deep, 32)).toBe(33);
  });
});

describe("pathOfNul", () => {
  it("when a NUL hides deep in a body, then its path is found without recursion", () => {
    let body: unknown = "tail\u0000";
    for (let i = 0; i < 100_000; i++) body = [body];
    const path = pathOfNul({ outer: body });
    expect(path).toHaveLength(100_001);
    expect(path?.[0]).toBe("outer");
  });

  it("when no string holds a NUL, then nothing is found", () => {
    expect(pathOfNul({ a: ["x", { b: "y" }], c: 1, d: null })).toBeNull();
    expect(pathOfNul({ a: ["x", { b: "y\u0000" }] })).toEqual(["a", "1", "b"]);
    expect(pathOfNul({ first: "a\u0000", second: "b\u0000" })).toEqual(["first"]);
  });
});
