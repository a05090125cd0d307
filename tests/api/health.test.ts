import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

describe("GET /api/health", () => {
  it("answers 200 with the database and mail up", async () => {
    const visitor = await app.visitor();
    const response = await visitor.get("/api/health").expect(200);
    expect(response.body).toEqual({ status: "ok", database: "up", mail: "up", storage: "up" });
  });
});
