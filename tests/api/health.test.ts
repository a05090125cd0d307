import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createUser } from "../factories/accounts";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

describe("GET /api/health", () => {
  it("answers a signed-in caller 200 with the database, mail and storage up", async () => {
    const person = await app.signedIn(await createUser(app.db));
    const response = await person.get("/api/health").expect(200);
    expect(response.body).toEqual({ status: "ok", database: "up", mail: "up", storage: "up" });
  });

  it("when anonymous callers ask again and again, then they get the status alone and no mail or storage connection is opened", async () => {
    const mail = vi.spyOn(app.deps.mailer, "verify");
    const storage = vi.spyOn(app.deps.storage, "up");
    try {
      const visitor = await app.visitor();
      for (let i = 0; i < 20; i++) {
        const response = await visitor.get("/api/health").expect(200);
        expect(response.body).toEqual({ status: "ok", database: "up" });
      }
      expect(mail).not.toHaveBeenCalled();
      expect(storage).not.toHaveBeenCalled();
    } finally {
      mail.mockRestore();
      storage.mockRestore();
    }
  });

  it("when a signed-in caller asks many times in a row, then mail and storage are each checked once and the state kept a few seconds", async () => {
    const person = await app.signedIn(await createUser(app.db));
    await person.get("/api/health").expect(200);
    const mail = vi.spyOn(app.deps.mailer, "verify");
    const storage = vi.spyOn(app.deps.storage, "up");
    try {
      await Promise.all(Array.from({ length: 10 }, () => person.get("/api/health").expect(200)));
      for (let i = 0; i < 10; i++) expect((await person.get("/api/health").expect(200)).body.mail).toBe("up");
      expect(mail.mock.calls.length).toBeLessThanOrEqual(1);
      expect(storage.mock.calls.length).toBeLessThanOrEqual(1);
    } finally {
      mail.mockRestore();
      storage.mockRestore();
    }
  });
});
