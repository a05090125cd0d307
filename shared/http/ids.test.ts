import { describe, expect, it } from "vitest";
import { isUuid } from "./ids";

describe("ids that can name a row", () => {
  it("takes the 8-4-4-4-12 hexadecimal form in either case (RFC 4122, section 3), and nothing else", () => {
    // The example UUID of RFC 4122, section 3 (urn:uuid:f81d4fae-…), quoted from memory.
    expect(isUuid("f81d4fae-7dec-11d0-a765-00a0c91e6bf6")).toBe(true);
    expect(isUuid("F81D4FAE-7DEC-11D0-A765-00A0C91E6BF6")).toBe(true);
    for (const bad of ["", "not-a-uuid", "f81d4fae7dec11d0a76500a0c91e6bf6", "f81d4fae-7dec-11d0-a765-00a0c91e6bf6x", "g81d4fae-7dec-11d0-a765-00a0c91e6bf6", null, 42]) {
      expect(isUuid(bad)).toBe(false);
    }
  });
});
