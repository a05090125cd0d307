import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { decodeCursor, encodeCursor, footageQuerySchema, footageSearchParams } from "./footage-query";

describe("the footage list's query", () => {
  it("when a cursor is encoded, then it decodes to the same value, and a tampered one to null", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 50 }), fc.integer()), fc.uuid(), (v, id) => {
        expect(decodeCursor(encodeCursor({ v, id }))).toEqual({ v, id });
      }),
    );
    expect(decodeCursor("not-a-cursor")).toBeNull();
    expect(decodeCursor(encodeCursor({ v: 1, id: "x" } as never))).toBeNull();
  });

  it("when the URL leaves things out, then defaults apply; blanks are as if unset", () => {
    expect(footageQuerySchema.parse({ tag: "  ", rating: "" })).toMatchObject({ sort: "recorded", dir: "desc", limit: 50, tag: undefined, rating: undefined });
    expect(footageSearchParams({ sort: "recorded", dir: "desc", tag: "wiring", rating: undefined }).toString()).toBe("tag=wiring");
  });
});
