import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { Sha256 } from "./sha256";

const text = (s: string) => new TextEncoder().encode(s);

describe("SHA-256 in pieces", () => {
  it("matches the FIPS 180-2 examples", () => {
    // FIPS 180-2, Appendix B.1 ("abc") and B.2 (the 448-bit message).
    expect(new Sha256().update(text("abc")).hex()).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(new Sha256().update(text("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")).hex()).toBe("248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
    // The empty message (NIST's published digest of the zero-length input).
    expect(new Sha256().hex()).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });

  it("matches FIPS 180-2 B.3 (a million 'a') fed in uneven pieces", () => {
    const hash = new Sha256();
    const piece = text("a".repeat(999));
    for (let sent = 0; sent < 1_000_000; sent += 999) hash.update(sent + 999 <= 1_000_000 ? piece : piece.subarray(0, 1_000_000 - sent));
    expect(hash.hex()).toBe("cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
  });

  it("gives the same digest however the bytes are cut into pieces", () => {
    fc.assert(
      fc.property(fc.array(fc.uint8Array({ maxLength: 200 }), { maxLength: 8 }), (pieces) => {
        const whole = new Uint8Array(pieces.reduce((n, p) => n + p.length, 0));
        let at = 0;
        for (const p of pieces) {
          whole.set(p, at);
          at += p.length;
        }
        const hash = new Sha256();
        for (const p of pieces) hash.update(p);
        expect(hash.hex()).toBe(new Sha256().update(whole).hex());
      }),
    );
  });
});
