import express from "express";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { errorMiddleware } from "../../server/http/error-middleware";

/** An app whose one route fails with the given error. */
function failingWith(error: unknown) {
  const app = express();
  app.get("/", () => {
    throw error;
  });
  app.use(errorMiddleware);
  return app;
}

describe("what an unexpected error answers", () => {
  it("when the driver's refusal is wrapped, as drizzle wraps it, then the answer is 503", async () => {
    const refused = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:5432"), { code: "ECONNREFUSED" });
    const res = await request(failingWith(new Error("Failed query: select 1", { cause: refused }))).get("/");
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe("unavailable");
  });

  it("when an error's causes loop back on each other, then the answer is a plain 500", async () => {
    const first = new Error("first");
    const second = new Error("second", { cause: first });
    (first as Error & { cause?: unknown }).cause = second;
    const res = await request(failingWith(first)).get("/");
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe("internal");
  });
});
