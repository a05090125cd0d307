import fc from "fast-check";
import type { z } from "zod";
import { describe, expect, it } from "vitest";
import { clipMetadataSchema, shootDayPatchSchema, shootDaySchema } from "../rushes/schemas";
import { dueOverrideSchema, episodeChangesSchema, episodeFieldsSchema } from "../slate/schemas";
import { createDealSchema, moneyFields, newDeliverableSchema, updateDealSchema, updateDeliverableSchema } from "../sponsors/schemas";
import { calendarDateSchema, dateMessages, recordedInstantSchema } from "./dates";

/** Reference: a proleptic Gregorian date check on UTC fields (ECMAScript's Date.UTC, ECMA-262 §21.4.1). */
function referenceDate(year: number, month: number, day: number): string | null {
  const at = new Date(Date.UTC(year, month - 1, day));
  at.setUTCFullYear(year);
  if (at.getUTCFullYear() !== year || at.getUTCMonth() !== month - 1 || at.getUTCDate() !== day) return null;
  return `${String(year).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
}

const extremeDates = ["9999-12-31", "0000-01-01", "0001-01-01", "1999-12-31", "2101-01-01", "+275760-09-13", "-000001-01-01", "2026-02-30", "2026-13-01", "20260101", ""];

describe("calendar dates", () => {
  it("when any year, month and day are written out, then exactly the real dates of 2000–2100 pass", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 9999 }), fc.integer({ min: 0, max: 13 }), fc.integer({ min: 0, max: 32 }), (year, month, day) => {
        const text = `${String(year).padStart(4, "0")}-${String(month).padStart(2, "0")}-${String(day).padStart(2, "0")}`;
        const real = referenceDate(year, month, day);
        expect(calendarDateSchema.safeParse(text).success).toBe(real !== null && year >= 2000 && year <= 2100);
      }),
      { numRuns: 3000 },
    );
  });

  it("when a date is out of range, impossible or misshapen, then the message says which", () => {
    expect(calendarDateSchema.safeParse("9999-12-31").error?.issues[0]?.message).toBe(dateMessages.range);
    expect(calendarDateSchema.safeParse("1999-12-31").error?.issues[0]?.message).toBe(dateMessages.range);
    expect(calendarDateSchema.safeParse("2028-02-30").error?.issues[0]?.message).toBe(dateMessages.missing);
    expect(calendarDateSchema.safeParse("0000-01-01").error?.issues[0]?.message).toBe(dateMessages.missing);
    expect(calendarDateSchema.safeParse("2028-2-3").error?.issues[0]?.message).toBe(dateMessages.shape);
    expect(calendarDateSchema.safeParse("2000-01-01").success).toBe(true);
    expect(calendarDateSchema.safeParse("2100-12-31").success).toBe(true);
    // 2100 is not a leap year (Gregorian rule: centuries only when divisible by 400); 2000 is.
    expect(calendarDateSchema.safeParse("2100-02-29").success).toBe(false);
    expect(calendarDateSchema.safeParse("2000-02-29").success).toBe(true);
  });
});

describe("recorded instants", () => {
  it("when a camera time is far out, then it is refused; old real years are kept", () => {
    expect(recordedInstantSchema.safeParse("9999-12-31T00:00:00Z").success).toBe(false);
    expect(recordedInstantSchema.safeParse("0000-01-01T00:00:00Z").success).toBe(false);
    expect(recordedInstantSchema.safeParse("2101-01-02T00:00:00+02:00").success).toBe(false);
    expect(recordedInstantSchema.safeParse("1904-01-01T00:00:00Z").success).toBe(true);
    expect(recordedInstantSchema.safeParse("2026-11-20T10:15:00+01:00").success).toBe(true);
  });
});

/** Every date field a request can carry, each with the field's own schema: none may take an extreme date. */
const dateFields: [string, z.ZodType][] = [
  ["episode targetPublishDate (new)", episodeFieldsSchema.shape.targetPublishDate],
  ["episode targetPublishDate (edit)", episodeChangesSchema.shape.targetPublishDate],
  ["stage due date", dueOverrideSchema.shape.dueDate],
  ["shoot day", shootDaySchema.shape.day],
  ["shoot day (edit)", shootDayPatchSchema.shape.day],
  ["deal go-live", createDealSchema.shape.goLiveDate],
  ["deal go-live (edit)", updateDealSchema.shape.goLiveDate],
  ["invoiced on", moneyFields.invoicedOn],
  ["paid on", moneyFields.paidOn],
  ["deliverable fixed date", newDeliverableSchema.shape.fixedDate],
  ["deliverable fixed date (edit)", updateDeliverableSchema.shape.fixedDate],
];

describe("every date a request carries", () => {
  it.each(dateFields)("when %s is extreme, then it is refused; a date inside the range passes", (_name, field) => {
    for (const date of extremeDates.filter((d) => d !== "")) expect(field.safeParse(date).success, date).toBe(false);
    expect(field.safeParse("2031-06-15").success).toBe(true);
  });

  it("when a clip's recorded time is extreme, then its metadata is refused", () => {
    const metadata = { durationMs: 1000, frameRate: null, dropFrame: false, width: null, height: null, codec: null, startTimecode: null, recordedAt: "9999-12-31T23:59:59Z", camera: "" };
    expect(clipMetadataSchema.safeParse(metadata).success).toBe(false);
    expect(clipMetadataSchema.safeParse({ ...metadata, recordedAt: "2031-06-15T09:00:00Z" }).success).toBe(true);
  });
});
