import { brotliDecompressSync, gunzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { encodedBody, type Answer } from "./board.service";

const answerOf = (cards: number): Answer => {
  const card = JSON.stringify({ id: "card", title: "A card on the board with a title of some length", stage: "build", tags: ["rotor", "fans"] });
  return { etag: 'W/"b1-x"', head: Buffer.from(`{"episodes":[${Array(cards).fill(card).join(",")}]`), tail: Buffer.from("}"), encoded: {} };
};
const textOf = (answer: Answer) => Buffer.concat([answer.head, answer.tail]).toString();

/** Until the background brotli is ready: it runs on libuv's threads and lands on a later turn of the loop. */
async function brotliReady(answer: Answer): Promise<void> {
  while (!answer.encoded.br) await new Promise((resolve) => setTimeout(resolve, 5));
}

describe("the board's body, encoded", () => {
  it("when a big board is asked for by clients taking brotli and gzip, then it goes gzipped until brotli, started by the second ask, is ready", async () => {
    const answer = answerOf(2_000);
    const first = encodedBody(answer, ["br", "gzip"]);
    expect(first.encoding).toBe("gzip");
    expect(gunzipSync(first.body).toString()).toBe(textOf(answer));
    expect(answer.brotliStarted).toBeUndefined();
    const second = encodedBody(answer, ["br", "gzip"]);
    expect(second).toEqual(first);
    expect(answer.brotliStarted).toBe(true);
    await brotliReady(answer);
    const later = encodedBody(answer, ["br", "gzip"]);
    expect(later.encoding).toBe("br");
    expect(brotliDecompressSync(later.body).toString()).toBe(textOf(answer));
  });

  it("when the board is small, or the client takes only brotli, then brotli is made at once", () => {
    expect(encodedBody(answerOf(3), ["br", "gzip"]).encoding).toBe("br");
    const onlyBrotli = answerOf(2_000);
    expect(brotliDecompressSync(encodedBody(onlyBrotli, ["br"]).body).toString()).toBe(textOf(onlyBrotli));
  });

  it("when the client takes only gzip, then gzip", () => {
    expect(encodedBody(answerOf(2_000), ["gzip"]).encoding).toBe("gzip");
  });
});
