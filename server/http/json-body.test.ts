import { Readable } from "node:stream";
import type { Request, Response } from "express";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { jsonBodyFor, jsonShape } from "./json-body";
import { publicAccess } from "./route-table";
import { pathOfNul } from "./validate";

const bytes = (text: string) => new TextEncoder().encode(text);
/** `{"name":[[[…]]]}`, `depth` arrays deep (the server's tests may not import the API tests' helpers). */
const deeplyNested = (depth: number) => `{"name":${"[".repeat(depth)}${"]".repeat(depth)}}`;

/** The shape as JSON.parse sees it, counted on the parsed value (the reference the byte scan must agree with). */
function parsedShape(value: unknown): { depth: number; items: number } {
  if (typeof value !== "object" || value === null) return { depth: 0, items: 0 };
  const inner = Object.values(value).map(parsedShape);
  return { depth: 1 + Math.max(0, ...inner.map((s) => s.depth)), items: Math.max(Object.keys(value).length, ...inner.map((s) => s.items)) };
}

describe("jsonShape", () => {
  it("when JSON texts are generated, then the byte scan agrees with the parsed value's depth and longest list", () => {
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 12 }), fc.boolean(), (value, spaced) => {
        const text = JSON.stringify(value, null, spaced ? 2 : undefined);
        expect(jsonShape(bytes(text))).toEqual(parsedShape(JSON.parse(text)));
      }),
      { numRuns: 500 },
    );
  });

  it("when brackets, commas, quotes and backslashes sit inside strings, then they are not counted", () => {
    expect(jsonShape(bytes(JSON.stringify({ a: '[[{{"\\"]]},,,}', b: ["\\", '"[,'] })))).toEqual({ depth: 2, items: 2 });
    expect(jsonShape(bytes(JSON.stringify("[[[[,,,")))).toEqual({ depth: 0, items: 0 });
    expect(jsonShape(bytes(JSON.stringify({ "k[[,": "é☃👩🏽‍🔧[[," })))).toEqual({ depth: 1, items: 1 });
    expect(jsonShape(bytes("[ [ ] , { } ]"))).toEqual({ depth: 2, items: 2 });
  });

  it("when a text is far deeper or longer than the limits, then the scan stops just past them", () => {
    expect(jsonShape(bytes("[".repeat(1_000_000)), { depth: 32, items: 1000 }).depth).toBe(33);
    expect(jsonShape(bytes(`[${"0,".repeat(1_000_000)}0]`), { depth: 32, items: 1000 }).items).toBe(1001);
  });
});

describe("pathOfNul", () => {
  it("when a NUL hides deep in a body, then its path is found without recursion", () => {
    let body: unknown = "tail\u0000";
    for (let i = 0; i < 100_000; i++) body = [body];
    const path = pathOfNul({ outer: body });
    expect(path).toHaveLength(100_001);
    expect(path?.[0]).toBe("outer");
  });

  it("when no string holds a NUL, then nothing is found", () => {
    expect(pathOfNul({ a: ["x", { b: "y" }], c: 1, d: null })).toBeNull();
    expect(pathOfNul({ a: ["x", { b: "y\u0000" }] })).toEqual(["a", "1", "b"]);
    expect(pathOfNul({ first: "a\u0000", second: "b\u0000" })).toEqual(["first"]);
  });
});

describe("reading a route's body", () => {
  /** A request as Node hands it to the server: a stream of the body's bytes with its headers. */
  function requestOf(text: string) {
    const bytes = Buffer.from(text);
    const req = Object.assign(Readable.from([bytes]), {
      method: "POST",
      url: "/api/auth/sign-up",
      headers: { "content-type": "application/json", "content-length": String(bytes.length) },
    });
    return req as unknown as Request;
  }

  function read(text: string): Promise<{ error: unknown; ms: number }> {
    const reader = jsonBodyFor({ method: "post", path: "/api/auth/sign-up", access: publicAccess, handler: () => undefined });
    const start = process.hrtime.bigint();
    return new Promise((resolve) => {
      reader(requestOf(text), {} as Response, (error?: unknown) => resolve({ error, ms: Number(process.hrtime.bigint() - start) / 1e6 }));
    });
  }

  it("when a 6,000-deep body is read, then each is refused as too deep, the middle one of fifty reads taking under 5 ms", async () => {
    const times: number[] = [];
    for (let i = 0; i < 50; i++) {
      const { error, ms } = await read(deeplyNested(6000));
      expect(error).toMatchObject({ code: "validation_failed", status: 400 });
      times.push(ms);
    }
    times.sort((a, b) => a - b);
    expect(times[Math.floor(times.length / 2)]).toBeLessThan(5);
  });

  it("when a body is within the limits, then it is parsed for the route", async () => {
    const req = requestOf(JSON.stringify({ name: "Ada", tags: [["a"]] }));
    const reader = jsonBodyFor({ method: "post", path: "/x", access: publicAccess, handler: () => undefined });
    await new Promise<void>((resolve, reject) => reader(req, {} as Response, (error?: unknown) => (error ? reject(error as Error) : resolve())));
    expect(req.body).toEqual({ name: "Ada", tags: [["a"]] });
  });
});
