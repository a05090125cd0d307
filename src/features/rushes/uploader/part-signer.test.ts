import { describe, expect, it } from "vitest";
import { SIGN_AHEAD } from "@shared/rushes/limits";
import type { PartUrlsInput } from "@shared/rushes/schemas";
import { PartSigner } from "./part-signer";

const plan = { uploadId: "u", partSize: 10, size: 395, partCount: 40 };

function kerf() {
  const asked: number[][] = [];
  const signer = new PartSigner(async (_uploadId, parts: PartUrlsInput["parts"]) => {
    asked.push(parts.map((p) => p.partNumber));
    return parts.map((p) => ({ partNumber: p.partNumber, start: 0, end: p.size, url: `url-${p.partNumber}` }));
  });
  return { signer, asked };
}
const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);

describe("signed part URLs, asked for ahead of their turn", () => {
  it("when parts go one after another, then each request signs SIGN_AHEAD parts, asked before any of them is due", async () => {
    const { signer, asked } = kerf();
    for (let n = 1; n <= 20; n++) expect(await signer.urlFor(plan, n, 10, () => false)).toBe(`url-${n}`);
    expect(asked[0]).toEqual(range(1, SIGN_AHEAD));
    expect(asked[1]).toEqual(range(SIGN_AHEAD + 1, 2 * SIGN_AHEAD));
    // Every part after the first had its URL kept when its turn came: one request per SIGN_AHEAD parts.
    expect(asked.flat()).toEqual(range(1, asked.flat().length));
    expect(asked.every((parts) => parts.length === SIGN_AHEAD)).toBe(true);
    expect(asked.flat().length).toBeGreaterThanOrEqual(20);
  });

  it("when parts are already stored (a resumed upload), then they are never signed", async () => {
    const { signer, asked } = kerf();
    const stored = (n: number) => n % 2 === 0;
    await signer.urlFor(plan, 1, 10, stored);
    expect(asked[0]!.filter(stored)).toEqual([]);
  });

  it("when the last part is shorter, then it is signed for its own length", async () => {
    const sizes: number[] = [];
    const signer = new PartSigner(async (_uploadId, parts) => {
      sizes.push(...parts.filter((p) => p.partNumber === 40).map((p) => p.size));
      return parts.map((p) => ({ partNumber: p.partNumber, start: 0, end: p.size, url: `url-${p.partNumber}` }));
    });
    for (let n = 30; n <= 40; n++) await signer.urlFor(plan, n, 10, () => false);
    expect(sizes).toEqual([5]);
  });
});
