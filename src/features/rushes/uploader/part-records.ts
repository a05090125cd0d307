import { RECORD_BATCH, RECORD_EVERY_MS, RECORDS_PER_REQUEST } from "@shared/rushes/limits";
import type { UploadPart } from "@shared/rushes/schemas";

/**
 * One upload's records of parts that reached storage, on their way to Kerf. A record waits here until
 * RECORD_BATCH are waiting or RECORD_EVERY_MS after the first, then they go together in one request; a
 * request that fails puts its records back to go with the next one. `flush()` sends all now and waits;
 * `sendAsPageCloses()` sends all in requests that outlive the page.
 */
export class PartRecords {
  private waiting = new Map<number, UploadPart>();
  private sent = new Map<number, UploadPart>();
  private requests = new Set<Promise<void>>();
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor(
    private readonly send: (parts: UploadPart[], leaving: boolean) => Promise<unknown>,
    private readonly recorded: (parts: UploadPart[]) => void,
  ) {}

  has(partNumber: number): boolean {
    return this.waiting.has(partNumber) || this.sent.has(partNumber);
  }

  /** Bytes in storage whose record Kerf has not confirmed yet. */
  bytes(): number {
    return [...new Map([...this.sent, ...this.waiting]).values()].reduce((sum, part) => sum + part.size, 0);
  }

  add(part: UploadPart) {
    this.waiting.set(part.partNumber, part);
    if (this.waiting.size >= RECORD_BATCH) this.sendWaiting();
    else this.timer ??= setTimeout(() => this.sendWaiting(), RECORD_EVERY_MS);
  }

  /** Sends every waiting record and waits for all sent; rejects when Kerf didn't take some (they wait again). */
  async flush(): Promise<void> {
    this.sendWaiting();
    const failed = (await Promise.allSettled([...this.requests])).find((r) => r.status === "rejected");
    // A request that failed before this flush had its records sent again in it.
    if (failed && this.waiting.size > 0) throw failed.reason;
  }

  /** The page is closing: the waiting records go now, in requests the browser finishes after it. */
  sendAsPageCloses() {
    this.sendWaiting(true);
  }

  /** The upload was cancelled: nothing more to tell Kerf. */
  drop() {
    this.stopTimer();
    this.waiting.clear();
  }

  private stopTimer() {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  private sendWaiting(leaving = false) {
    this.stopTimer();
    while (this.waiting.size > 0) {
      const parts = [...this.waiting.values()].slice(0, RECORDS_PER_REQUEST);
      for (const part of parts) {
        this.waiting.delete(part.partNumber);
        this.sent.set(part.partNumber, part);
      }
      const request = this.send(parts, leaving).then(
        () => {
          this.answered(parts, false);
          this.recorded(parts);
        },
        (error: unknown) => {
          this.answered(parts, true);
          throw error;
        },
      );
      this.requests.add(request);
      request.catch(() => undefined).finally(() => this.requests.delete(request));
    }
  }

  /** A part sent again meanwhile (a newer record) keeps its newer record. */
  private answered(parts: UploadPart[], putBack: boolean) {
    for (const part of parts) {
      if (this.sent.get(part.partNumber) === part) this.sent.delete(part.partNumber);
      if (putBack && !this.has(part.partNumber)) this.waiting.set(part.partNumber, part);
    }
  }
}
