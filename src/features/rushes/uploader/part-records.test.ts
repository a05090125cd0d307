import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { RECORD_BATCH, RECORD_EVERY_MS } from "@shared/rushes/limits";
import type { UploadPart } from "@shared/rushes/schemas";
import { PartRecords } from "./part-records";

const part = (partNumber: number, etag = `e${partNumber}`): UploadPart => ({ partNumber, etag, size: 10 });

/** A Kerf stand-in that answers each request when told to. */
function kerf() {
  const requests: { parts: number[]; leaving: boolean; answer: (ok: boolean) => void }[] = [];
  const recorded: number[] = [];
  const records = new PartRecords(
    (parts, leaving) =>
      new Promise((resolve, reject) => {
        requests.push({ parts: parts.map((p) => p.partNumber), leaving, answer: (ok) => (ok ? resolve(undefined) : reject(new Error("Kerf didn't answer."))) });
      }),
    (parts) => recorded.push(...parts.map((p) => p.partNumber)),
  );
  return { records, requests, recorded };
}

/** Lets the promise callbacks of an answer run. */
async function answered() {
  for (let i = 0; i < 5; i++) await Promise.resolve();
}

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe("records of stored parts, sent in batches", () => {
  it("when RECORD_BATCH parts are stored, then their records go in one request at once", async () => {
    const { records, requests, recorded } = kerf();
    for (let n = 1; n < RECORD_BATCH; n++) records.add(part(n));
    expect(requests).toEqual([]);
    records.add(part(RECORD_BATCH));
    expect(requests.map((r) => r.parts)).toEqual([Array.from({ length: RECORD_BATCH }, (_, i) => i + 1)]);
    expect(records.has(1)).toBe(true);
    expect(records.bytes()).toBe(10 * RECORD_BATCH);
    requests[0]!.answer(true);
    await answered();
    expect(recorded).toHaveLength(RECORD_BATCH);
    expect(records.has(1)).toBe(false);
    expect(records.bytes()).toBe(0);
  });

  it("when fewer parts are stored, then they go RECORD_EVERY_MS after the first, not before", () => {
    const { records, requests } = kerf();
    records.add(part(1));
    vi.advanceTimersByTime(RECORD_EVERY_MS / 2);
    records.add(part(2));
    vi.advanceTimersByTime(RECORD_EVERY_MS / 2 - 1);
    expect(requests).toEqual([]);
    vi.advanceTimersByTime(1);
    expect(requests.map((r) => r.parts)).toEqual([[1, 2]]);
  });

  it("when a request fails, then its records wait for the next one, and flush sends them and waits for Kerf", async () => {
    const { records, requests, recorded } = kerf();
    records.add(part(1));
    records.add(part(2));
    vi.advanceTimersByTime(RECORD_EVERY_MS);
    requests[0]!.answer(false);
    await answered();
    expect(records.has(1)).toBe(true);
    expect(records.bytes()).toBe(20);
    records.add(part(3));
    const flushed = records.flush();
    expect(requests.map((r) => r.parts)).toEqual([[1, 2], [1, 2, 3]]);
    requests[1]!.answer(true);
    await flushed;
    expect(recorded).toEqual([1, 2, 3]);
  });

  it("when flush finds Kerf refusing, then it rejects and keeps the records to send again", async () => {
    const { records, requests } = kerf();
    records.add(part(4));
    const flushed = records.flush();
    requests[0]!.answer(false);
    await expect(flushed).rejects.toThrow("Kerf didn't answer.");
    expect(records.has(4)).toBe(true);
  });

  it("when a part is stored again while its first record is on its way, then the newer record is the one kept", async () => {
    const { records, requests } = kerf();
    records.add(part(5, "old"));
    void records.flush().catch(() => undefined);
    records.add(part(5, "new"));
    requests[0]!.answer(false);
    const flushed = records.flush();
    expect(requests.map((r) => r.parts)).toEqual([[5], [5]]);
    requests[1]!.answer(true);
    await flushed;
    expect(records.has(5)).toBe(false);
  });

  it("when the page closes, then the waiting records go at once in a request that outlives the page", () => {
    const { records, requests } = kerf();
    records.add(part(1));
    records.add(part(2));
    records.sendAsPageCloses();
    expect(requests.map((r) => [r.parts, r.leaving])).toEqual([[[1, 2], true]]);
    records.add(part(3));
    vi.advanceTimersByTime(RECORD_EVERY_MS);
    expect(requests.at(-1)).toMatchObject({ parts: [3], leaving: false });
  });
});
