import { describe, expect, it } from "vitest";
import { spokenTokens } from "./spoken-numbers";

const tokens = (text: string) => spokenTokens(text).map((t) => t.token).join(" ");

describe("numbers written as words", () => {
  // The test suite of the npm package words-to-numbers 1.5.1 (finnfiddle/words-to-numbers, src/__tests__/index.js):
  // its inputs and the numbers it expects, one `it` of it per row. Kerf leaves out its ordinals ("second" is also a
  // noun), "dot" for "point" (a script spells web addresses with "dot"), and its fuzzy spellings.
  it.each([
    ["one hundred", "100"],
    ["one hundred and five", "105"],
    ["one hundred and twenty five", "125"],
    ["four thousand and thirty", "4030"],
    ["six million five thousand and two", "6005002"],
    ["a thousand one hundred and eleven", "1111"],
    ["sixty nine", "69"],
    ["twenty thousand five hundred and sixty nine", "20569"],
    ["five quintillion", "5000000000000000000"],
    ["one-hundred", "100"],
    ["one-hundred and twenty-five", "125"],
    ["six-million five-thousand and two", "6005002"],
    ["a thousand, one-hundred and eleven", "1111"],
    ["twenty-thousand, five-hundred and sixty-nine", "20569"],
    ["there were twenty-thousand, five-hundred and sixty-nine X in the five quintillion Y", "there were 20569 x in the 5000000000000000000 y"],
    ["one two three", "1 2 3"],
    ["test one two three test", "test 1 2 3 test"],
    ["forty two point five", "42.5"],
    ["ten point five", "10.5"],
    ["three point one four one five nine two six", "3.1415926"],
    ["digit one", "digit 1"],
    ["one thirty", "1 30"],
    ["thousand", "1000"],
    ["million", "1000000"],
    ["billion", "1000000000"],
    ["xxxxxxx one hundred", "xxxxxxx 100"],
    ["and", "and"],
    ["a", "a"],
    ["junkvalue", "junkvalue"],
    ["Fifty People, One Question: Brooklyn", "50 people 1 question brooklyn"],
  ])("reads %j as %j", (text, expected) => {
    expect(tokens(text)).toBe(expected);
  });

  it("keeps words that only look like numbers as words", () => {
    // Own cases: an ordinal, "point" with no digits after it, and "a" not before a hundred or a scale.
    expect(tokens("a second battery")).toBe("a second battery");
    expect(tokens("the point is")).toBe("the point is");
    expect(tokens("one point")).toBe("1 point");
    expect(tokens("zero one")).toBe("0 1");
  });

  it("reads digits as their value, with thousands separators and scale words", () => {
    // A point as the decimal marker and digits grouped in threes (SI Brochure, BIPM, 9th ed., 2019, 5.4.4, which
    // groups with thin spaces; the comma between groups is English common practice). "1,5" is no English number.
    expect(tokens("2,500 and 0.10 and 08")).toBe("2500 and 0.1 and 8");
    expect(tokens("1.5 million and 3 hundred")).toBe("1500000 and 300");
    expect(tokens("1,5")).toBe("1 5");
  });
});

describe("units and currencies", () => {
  it("reads a symbol after a number and the unit's name as one token", () => {
    // SI Brochure (BIPM, 9th ed., 2019), 5.4.7: "%" is a symbol for 0.01; "percent" and "per cent" are the US and
    // British spellings (common practice). 5.4.3: the number and the symbol apart or together, never a plural symbol.
    for (const text of ["80%", "80 %", "eighty percent", "eighty per cent", "Eighty-percent"]) expect(tokens(text)).toBe("80 percent");
    for (const text of ["300 W", "300W", "three hundred watts", "300 watt"]) expect(tokens(text)).toBe("300 watt");
    for (const text of ["2,500 mAh", "two thousand five hundred milliamp hours"]) expect(tokens(text)).toBe("2500 milliampere-hour");
    for (const text of ["20 °C", "20°C", "twenty degrees Celsius"]) expect(tokens(text)).toBe("20 degree-celsius");
  });

  it("puts a currency symbol after its amount, as the amount is said", () => {
    for (const text of ["$50", "50 dollars", "fifty dollars", "$ 50"]) expect(tokens(text)).toBe("50 dollar");
    expect(tokens("€1,200")).toBe("1200 euro");
  });

  it("leaves a symbol that follows no number as a word", () => {
    expect(tokens("a V belt, plan a")).toBe("a v belt plan a");
  });

  it("keeps what was said for each token", () => {
    expect(spokenTokens("Eighty percent in 2 hrs")).toEqual([
      { token: "80", said: "eighty" },
      { token: "percent", said: "percent" },
      { token: "in", said: "in" },
      { token: "2", said: "2" },
      { token: "hour", said: "hrs" },
    ]);
  });
});
