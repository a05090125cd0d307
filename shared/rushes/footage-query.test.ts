import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { decodeCursor, encodeCursor, footageQuerySchema, footageSearchParams } from "./footage-query";

describe("the footage list's query", () => {
  it("when a cursor is encoded, then it decodes to the same value, and a tampered one to null", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 50 }).filter((v) => !v.includes("\u0000")), fc.uuid(), (v, id) => {
        expect(decodeCursor(encodeCursor({ v, id }), "name")).toEqual({ v, id });
      }),
    );
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2_147_483_647 }), fc.uuid(), (v, id) => {
        expect(decodeCursor(encodeCursor({ v: String(v), id }), "duration")).toEqual({ v: String(v), id });
      }),
    );
    expect(decodeCursor("not-a-cursor", "name")).toBeNull();
    expect(decodeCursor(encodeCursor({ v: 1, id: "x" } as never), "name")).toBeNull();
  });

  it("when a cursor's value is not of its sort's type, then it decodes to null", () => {
    const id = "00000000-0000-4000-8000-000000000001";
    const decode = (v: string | number, sort: Parameters<typeof decodeCursor>[1]) => decodeCursor(encodeCursor({ v, id }), sort);
    // Postgres's own text output of a timestamptz (PostgreSQL documentation, 8.5.2 Date/Time Output, ISO style).
    expect(decode("2026-12-03 23:41:43.123+00", "recorded")).not.toBeNull();
    expect(decode("2026-12-03 23:41:43+05:30", "uploaded")).not.toBeNull();
    for (const v of ["not a time", "0000-01-01 00:00:00+00", "2026-02-30 10:00:00+00", "2026-01-01 24:00:00+00", 5]) expect(decode(v, "recorded")).toBeNull();
    expect(decode("ten", "duration")).toBeNull();
    expect(decode(2_147_483_648, "duration")).toBeNull();
    expect(decode("9".repeat(19), "size")).toBeNull();
    expect(decode("a\u0000b", "name")).toBeNull();
  });

  it("when the URL leaves things out, then defaults apply; blanks are as if unset", () => {
    expect(footageQuerySchema.parse({ tag: "  ", rating: "" })).toMatchObject({ sort: "recorded", dir: "desc", limit: 50, tag: undefined, rating: undefined });
    expect(footageSearchParams({ sort: "recorded", dir: "desc", tag: "wiring", rating: undefined }).toString()).toBe("tag=wiring");
  });
});
