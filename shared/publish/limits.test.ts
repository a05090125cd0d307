import { describe, expect, it } from "vitest";
import { checkDescription, checkTitle, refusedCharacters, utf8Bytes } from "./limits";

// YouTube Data API v3 reference, "Videos" resource: snippet.title "maximum length of 100 characters",
// snippet.description "maximum length of 5000 bytes"; both "may contain all valid UTF-8 characters except < and >".
describe("title limit (100 characters)", () => {
  it("takes 100 characters and refuses 101", () => {
    expect(checkTitle("a".repeat(100)).problems).toEqual([]);
    expect(checkTitle("a".repeat(101)).problems).toEqual(["The title has 101 characters; the platform takes at most 100."]);
  });
  it("counts an emoji as one character", () => {
    expect(checkTitle("🔋".repeat(100)).used).toBe(100);
    expect(checkTitle("🔋".repeat(100)).problems).toEqual([]);
  });
  it("flags < and >", () => {
    expect(checkTitle("Motor <rated> test").problems[0]).toContain('"<" at line 1, column 7');
  });
});

describe("description limit (5,000 bytes of UTF-8)", () => {
  it("counts bytes, not characters", () => {
    // UTF-8 (RFC 3629, section 3): é is 2 bytes, € 3, 🔋 4.
    expect(utf8Bytes("é€🔋")).toBe(9);
    expect(checkDescription("é".repeat(2500)).problems).toEqual([]);
    expect(checkDescription("é".repeat(2501)).problems[0]).toMatch(/5002 bytes; the platform takes at most 5000/);
  });
  it("finds every refused character with its line", () => {
    expect(refusedCharacters("ok\n a > b < c")).toEqual([
      { character: ">", line: 2, column: 4 },
      { character: "<", line: 2, column: 8 },
    ]);
  });
});
