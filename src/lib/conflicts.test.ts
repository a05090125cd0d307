import { describe, expect, it } from "vitest";
import { ApiError } from "./api-client";
import { changedFields, staleRecord } from "./conflicts";

describe("a stale save", () => {
  it("when the server answers 409 with the record as it is now, then that record and the server's words come back", () => {
    const current = { id: "d1", version: 4, link: "https://example.com/new" };
    const error = new ApiError(409, "conflict", "Someone else changed this deal a moment ago.", {}, { error: {}, current });
    expect(staleRecord(error)).toEqual({ message: "Someone else changed this deal a moment ago.", current });
  });

  it("when the failure is anything else, then it is not a stale save", () => {
    expect(staleRecord(new ApiError(409, "conflict", "Already a member."))).toBeNull();
    expect(staleRecord(new ApiError(400, "validation_failed", "Some fields need attention.", {}, { current: {} }))).toBeNull();
    expect(staleRecord(new Error("offline"))).toBeNull();
  });
});

describe("the fields a save sends", () => {
  it("when some values differ from those the form opened with, then only those are sent, lists and nulls compared by value", () => {
    const opened = { link: "https://example.com/a", promoCode: "A5", talkingPoints: ["light", "strong"], contactId: null };
    expect(changedFields(opened, { link: "https://example.com/a", promoCode: "B10", talkingPoints: ["light", "strong"], contactId: null })).toEqual({ promoCode: "B10" });
    expect(changedFields(opened, { ...opened, talkingPoints: ["strong", "light"], contactId: "c1" })).toEqual({ talkingPoints: ["strong", "light"], contactId: "c1" });
    expect(changedFields(opened, { ...opened })).toEqual({});
  });
});
