import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { inAppPath } from "./next-path";

/*
 * The outside addresses below are the open-redirect forms listed in the OWASP Unvalidated Redirects
 * and Forwards Cheat Sheet and in the WHATWG URL Standard's parsing rules (backslash read as slash,
 * tab and newline removed, scheme-relative "//host").
 */
describe("where sign-in leads", () => {
  it("when next is a path inside Kerf, then it is kept with its query and fragment", () => {
    expect(inAppPath("/c/123/slate?owner=none#card-4")).toBe("/c/123/slate?owner=none#card-4");
    expect(inAppPath("/invitations/abc")).toBe("/invitations/abc");
  });

  it.each([
    "https://evil.example/",
    "//evil.example/path",
    "/\\evil.example",
    "\\\\evil.example",
    "/\t/evil.example",
    "/\n/evil.example",
    "javascript:alert(1)",
    "JaVaScRiPt:alert(1)",
    "data:text/html,<script>alert(1)</script>",
    "evil.example",
    "c/123/slate",
    "",
    null,
    undefined,
  ])("when next is %j, then sign-in goes home", (next) => {
    expect(inAppPath(next)).toBe("/");
  });

  it("when next is anything at all, then the answer is a path on Kerf's own origin", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string(), fc.webUrl(), fc.string().map((s) => `/${s}`), fc.string().map((s) => `//${s}`)), (next) => {
        const path = inAppPath(next);
        expect(path.startsWith("/")).toBe(true);
        expect(new URL(path, "https://kerf.example").origin).toBe("https://kerf.example");
      }),
      { numRuns: 2000 },
    );
  });
});
