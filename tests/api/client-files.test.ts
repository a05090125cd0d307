import express from "express";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { IMMUTABLE, REVALIDATE, serveClient } from "../../server/http/client-files";
import { SESSION_COOKIE } from "../../server/http/session";
import { builtClient } from "../support/built-client";

const app = express();
serveClient(app, builtClient());

describe("the built client's files", () => {
  it("sends brotli to a browser that takes it, with a year's immutable cache for a hashed file", async () => {
    const res = await request(app).get("/assets/index-abc123.js").set("Accept-Encoding", "gzip, deflate, br");
    expect(res.status).toBe(200);
    expect(res.headers["content-encoding"]).toBe("br");
    expect(res.headers["content-type"]).toMatch(/javascript/);
    expect(res.headers["cache-control"]).toBe(IMMUTABLE);
    expect(res.headers.vary).toMatch(/Accept-Encoding/);
  });

  it("sends gzip when brotli is not accepted, and the plain file when nothing is", async () => {
    const gz = await request(app).get("/assets/index-abc123.js").set("Accept-Encoding", "gzip");
    expect(gz.headers["content-encoding"]).toBe("gzip");
    const plain = await request(app).get("/assets/index-abc123.js").set("Accept-Encoding", "identity");
    expect(plain.headers["content-encoding"]).toBeUndefined();
    expect(plain.text).toContain("console.log('kerf');");
  });

  it("revalidates index.html and files without a hash, so a new release is seen at once", async () => {
    for (const address of ["/", "/channels/x/slate", "/favicon.svg"]) {
      const res = await request(app).get(address);
      expect(res.status).toBe(200);
      expect(res.headers["cache-control"]).toBe(REVALIDATE);
    }
  });

  it("asks for a page's own code in its index.html, and only that page's", async () => {
    const slate = await request(app).get("/c/x/slate");
    expect(slate.headers["content-type"]).toMatch(/html/);
    expect(slate.text).toContain('<link rel="modulepreload" crossorigin href="/assets/SlatePage-789abc.js">');
    expect(slate.text).toContain('href="/assets/AppShell-def456.js"');
    expect(slate.text).not.toContain('href="/assets/index-abc123.js"');
    const other = await request(app).get("/c/x/nowhere");
    expect(other.text).not.toContain("modulepreload");
  });

  it("asks for an episode part's code with the episode page's when the address names the part", async () => {
    const part = await request(app).get("/c/x/episodes/y/test-plan");
    expect(part.text).toContain('href="/assets/episode-page-1a2b3c.js"');
    expect(part.text).toContain('href="/assets/TestPlanSheet-4d5e6f.js"');
    const bare = await request(app).get("/c/x/episodes/y");
    expect(bare.text).toContain('href="/assets/episode-page-1a2b3c.js"');
    expect(bare.text).not.toContain("TestPlanSheet");
  });

  it("sends an episode's address without a part the page of the part it opens on, and the plain page when that can't be said", async () => {
    const opening = express();
    const parts: Record<string, () => Promise<string | null>> = { y: async () => "test-plan", z: async () => null, w: () => Promise.reject(new Error("database down")) };
    serveClient(opening, builtClient(), { session: [], part: (req) => parts[String(req.params.episodeId)]!() });
    const stagePart = await request(opening).get("/c/x/episodes/y").expect(200);
    expect(stagePart.text).toContain('href="/assets/episode-page-1a2b3c.js"');
    expect(stagePart.text).toContain('href="/assets/TestPlanSheet-4d5e6f.js"');
    for (const episode of ["z", "w"]) {
      const plain = await request(opening).get(`/c/x/episodes/${episode}`).expect(200);
      expect(plain.text).toContain('href="/assets/episode-page-1a2b3c.js"');
      expect(plain.text).not.toContain("TestPlanSheet");
    }
  });

  it("writes the app's stylesheet into index.html, with a link that is never fetched, and sends the page compressed", async () => {
    const page = await request(app).get("/sign-in").set("Accept-Encoding", "gzip, deflate, br");
    expect(page.headers["content-encoding"]).toBe("br");
    expect(page.headers.vary).toMatch(/Accept-Encoding/);
    expect(page.text).toContain("<style>.kerf-opening{color:#fbf9f5}</style>");
    expect(page.text).toContain('<link rel="stylesheet" crossorigin href="/assets/index-css123.css" disabled>');
    expect((await request(app).get("/sign-in").set("Accept-Encoding", "gzip")).headers["content-encoding"]).toBe("gzip");
    const plain = await request(app).get("/sign-in").set("Accept-Encoding", "identity");
    expect(plain.headers["content-encoding"]).toBeUndefined();
    expect(plain.text).toContain("<style>");
  });

  describe("a signed-in page's first answers, preloaded from its Link header", () => {
    const channel = "0b7e9a52-3f4c-4d2e-9a1b-5c6d7e8f9a0b";
    const episode = "1c8f0b63-4a5d-4e3f-8b2c-6d7e8f9a0b1c";
    const cookie = `${SESSION_COOKIE}=s%3Aanything`;

    it("names who is signed in and the slate's board and people", async () => {
      const res = await request(app).get(`/c/${channel}/slate`).set("Cookie", cookie);
      expect(res.headers.link).toBe(
        [`/api/auth/me`, `/api/channels/${channel}/episodes`, `/api/channels/${channel}/slate/people`].map((url) => `<${url}>; rel=preload; as=fetch; crossorigin`).join(", "),
      );
      expect(res.headers.vary).toMatch(/Cookie/);
    });

    it("names the episode on its page, whichever part is open", async () => {
      for (const part of ["", "/bench", "/build-log", "/money"]) {
        const res = await request(app).get(`/c/${channel}/episodes/${episode}${part}`).set("Cookie", cookie);
        expect(res.headers.link).toContain(`</api/channels/${channel}/episodes/${episode}>`);
      }
    });

    it("names the open part's first answers beside the episode's", async () => {
      const res = await request(app).get(`/c/${channel}/episodes/${episode}/test-plan`).set("Cookie", cookie);
      const episodeUrl = `/api/channels/${channel}/episodes/${episode}`;
      expect(res.headers.link).toBe([`/api/auth/me`, episodeUrl, `${episodeUrl}/test-plan`].map((url) => `<${url}>; rel=preload; as=fetch; crossorigin`).join(", "));
    });

    it("names nothing for a visitor without a session, an address with a query, or ids without an id's shape", async () => {
      expect((await request(app).get(`/c/${channel}/slate`)).headers.link).toBeUndefined();
      expect((await request(app).get(`/c/${channel}/slate?stage=build`).set("Cookie", cookie)).headers.link).toBeUndefined();
      expect((await request(app).get(`/c/${encodeURIComponent("x><script>")}/slate`).set("Cookie", cookie)).headers.link).toBeUndefined();
    });

    it("names only who is signed in on a page with nothing of its own", async () => {
      expect((await request(app).get("/account").set("Cookie", cookie)).headers.link).toBe("</api/auth/me>; rel=preload; as=fetch; crossorigin");
    });
  });

  it("does not serve the build's manifest", async () => {
    expect((await request(app).get("/.vite/manifest.json")).text).not.toContain("SlatePage");
  });

  it("leaves /api paths to the API", async () => {
    const res = await request(app).get("/api/nothing");
    expect(res.status).toBe(404);
  });
});
