import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { hasBidiControl, hasControlCharacter, hasLineBreak, hasVisibleText, multiLine, oneLine, textMessages, toPlainLine } from "./text";

/*
 * Sources: control characters are Unicode general category Cc (U+0000–U+001F, U+007F–U+009F); the
 * bidirectional embeddings, overrides and isolates are listed in Unicode Standard Annex #9, section 2
 * (U+202A–U+202E, U+2066–U+2069); invisible characters are the Default_Ignorable_Code_Point property
 * (Unicode Standard, section 5.21) plus White_Space; NFC is Unicode Standard Annex #15.
 */
const controls = [...Array.from({ length: 0x20 }, (_, i) => String.fromCharCode(i)), ...Array.from({ length: 0x21 }, (_, i) => String.fromCharCode(0x7f + i))];
const bidiControls = ["\u202A", "\u202B", "\u202C", "\u202D", "\u202E", "\u2066", "\u2067", "\u2068", "\u2069"];
const invisibles = [" ", "\u00A0", "\u00AD", "\u034F", "\u115F", "\u180E", "\u200B", "\u200C", "\u200D", "\u200E", "\u2060", "\u2800", "\u3000", "\u3164", "\uFE0F", "\uFEFF", "\u{E0020}"];

/** Text anyone might type: letters of several scripts, digits, punctuation, marks, emoji, inner spaces. */
const typedText = fc
  .array(fc.constantFrom("a", "Z", "ø", "é", "e\u0301", "ß", "Ж", "中", "ع", "ש", "7", "-", ".", "’", "“", "&", " ", "👩🏽‍🔧", "🔋", "°", "Ω", "µ"), { minLength: 1, maxLength: 40 })
  .map((parts) => parts.join(""))
  .filter(hasVisibleText);

const anyText = fc.oneof(fc.string({ unit: "binary", maxLength: 30 }), fc.string({ unit: "grapheme", maxLength: 30 }), fc.string({ maxLength: 30 }));
/** A visible character on either side, so trimming can't remove what is put in the middle. */
const around = (inner: string) => `x${inner}y`;

describe("one-line text", () => {
  const title = oneLine(120, { blank: "Name it." });

  it("when anything at all is sent, then whatever passes is trimmed NFC text with no control, line break or direction character", () => {
    fc.assert(
      fc.property(anyText, (input) => {
        const result = title.safeParse(input);
        if (!result.success) return;
        const text = result.data;
        expect(text).toBe(text.normalize("NFC"));
        expect(text).toBe(text.trim());
        expect(hasControlCharacter(text) || hasLineBreak(text) || hasBidiControl(text)).toBe(false);
        expect(hasVisibleText(text)).toBe(true);
        expect(text.length).toBeLessThanOrEqual(120);
      }),
      { numRuns: 2000 },
    );
  });

  it("when ordinary typed text is sent, then it is kept as typed, normalised and trimmed, and a second pass changes nothing", () => {
    fc.assert(
      fc.property(typedText, fc.constantFrom("", " ", "  "), (text, pad) => {
        const once = title.parse(`${pad}${text}${pad}`);
        expect(once).toBe(text.normalize("NFC").trim());
        expect(title.parse(once)).toBe(once);
      }),
    );
  });

  it("when a control character or line break sits inside the text, then it is refused", () => {
    fc.assert(
      fc.property(typedText, fc.constantFrom(...controls, "\u2028", "\u2029"), (text, control) => {
        expect(title.safeParse(around(`${text}${control}${text}`)).success).toBe(false);
      }),
    );
    expect(title.safeParse("Part one\r\nBcc: someone@example.com").error?.issues[0]?.message).toBe(textMessages.lineBreak);
    expect(title.safeParse("bell\u0007").error?.issues[0]?.message).toBe(textMessages.control);
  });

  it("when a direction override or isolate is anywhere in the text, then it is refused", () => {
    fc.assert(
      fc.property(typedText, fc.constantFrom(...bidiControls), fc.nat(), (text, bidi, at) => {
        const cut = at % (text.length + 1);
        const result = title.safeParse(`${text.slice(0, cut)}${bidi}${text.slice(cut)}`);
        expect(result.success).toBe(false);
      }),
    );
    expect(title.safeParse("invoice\u202Efdp.exe").error?.issues[0]?.message).toBe(textMessages.bidi);
  });

  it("when the text shows nothing (zero-width spaces, joiners, U+FEFF, blanks), then a required field says it is blank and an optional one refuses it unless empty", () => {
    const optional = oneLine(120);
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...invisibles), { minLength: 1, maxLength: 12 }), (parts) => {
        const text = parts.join("");
        const required = title.safeParse(text);
        expect(required.success).toBe(false);
        expect(required.error?.issues.map((i) => i.message)).toContain("Name it.");
        // White space alone trims to nothing (empty is fine when optional); anything else invisible is refused.
        expect(optional.safeParse(text).success).toBe(text.trim() === "");
      }),
    );
    expect(optional.parse("")).toBe("");
    expect(optional.parse("   ")).toBe("");
    expect(title.safeParse("").error?.issues[0]?.message).toBe("Name it.");
  });

  it("when a lone surrogate is sent, then it is refused as broken text", () => {
    expect(title.safeParse("half \uD83D of an emoji").error?.issues[0]?.message).toBe(textMessages.broken);
  });

  it("when text is longer than the limit once trimmed, then it is refused with the limit in the message", () => {
    expect(oneLine(5).parse("  abcde  ")).toBe("abcde");
    expect(oneLine(5).safeParse("abcdef").error?.issues[0]?.message).toBe("Keep this under 5 characters.");
    expect(oneLine(5, { tooLong: "Short, please." }).safeParse("abcdef").error?.issues[0]?.message).toBe("Short, please.");
  });

  it("when NFC and NFD forms of one word are sent, then both are stored the same", () => {
    expect(title.parse("Cafe\u0301")).toBe(title.parse("Caf\u00E9"));
  });
});

describe("multi-line text", () => {
  const notes = multiLine(2000);

  it("when notes have line breaks in any convention, then they are kept as \\n", () => {
    expect(notes.parse("first\r\nsecond\rthird\u2028fourth\nfifth")).toBe("first\nsecond\nthird\nfourth\nfifth");
  });

  it("when anything at all is sent, then whatever passes has no control character but \\n and no direction character", () => {
    fc.assert(
      fc.property(anyText, (input) => {
        const result = notes.safeParse(input);
        if (!result.success) return;
        expect(hasControlCharacter(result.data) || hasBidiControl(result.data) || /[\r\u2028\u2029]/.test(result.data)).toBe(false);
        expect(result.data === "" || hasVisibleText(result.data)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it("when a control character other than a line break sits inside, then it is refused", () => {
    fc.assert(
      fc.property(typedText, fc.constantFrom(...controls.filter((c) => c !== "\n" && c !== "\r")), (text, control) => {
        expect(notes.safeParse(around(`${text}\n${control}`)).success).toBe(false);
      }),
    );
  });
});

describe("text read from files", () => {
  it("when any text is made plain, then the one-line rule accepts it and keeps it within the limit", () => {
    const rule = oneLine(20);
    fc.assert(
      fc.property(anyText, (input) => {
        const plain = toPlainLine(input, 20);
        expect(rule.safeParse(plain).success).toBe(true);
        expect(plain.length).toBeLessThanOrEqual(20);
      }),
      { numRuns: 2000 },
    );
  });
});
