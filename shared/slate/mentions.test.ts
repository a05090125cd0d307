import { describe, expect, it } from "vitest";
import { completeMention, mentionAt, mentionedIn, mentionSuggestions } from "./mentions";

const people = [
  { id: "ana", name: "Ana" },
  { id: "ana-lee", name: "Ana Lee" },
  { id: "kwame", name: "Kwame Lindqvist" },
  { id: "ilse", name: "Ilse Marchetti" },
];

describe("mentions in a comment", () => {
  it("when a comment names members with @, then each is found once, in order", () => {
    expect(mentionedIn("@Kwame Lindqvist can you film it? @ilse marchetti, the cut. Thanks @Kwame Lindqvist", people)).toEqual(["kwame", "ilse"]);
  });

  it("when one name starts another, then the longer name wins", () => {
    expect(mentionedIn("@Ana Lee: see this", people)).toEqual(["ana-lee"]);
    expect(mentionedIn("@Ana, see this", people)).toEqual(["ana"]);
  });

  it("when @ sits inside a word or a name runs on, then nobody is mentioned", () => {
    expect(mentionedIn("mail kwame@example.com", people)).toEqual([]);
    expect(mentionedIn("@Anastasia was here", people)).toEqual([]);
    expect(mentionedIn("no mentions at all", people)).toEqual([]);
  });
});

describe("suggestions while typing", () => {
  it("when the caret follows an @ and part of a name, then that part is the query", () => {
    expect(mentionAt("Thanks @Kw", 10)).toEqual({ start: 7, query: "Kw" });
    expect(mentionAt("@", 1)).toEqual({ start: 0, query: "" });
    expect(mentionAt("@Kwame L", 8)).toEqual({ start: 0, query: "Kwame L" });
    expect(mentionAt("mail kwame@exa", 14)).toBeNull();
    expect(mentionAt("@Kwame\nnext", 11)).toBeNull();
    expect(mentionAt("no at sign", 5)).toBeNull();
  });

  it("when a query is typed, then names starting with it come first, then names with a word that does", () => {
    expect(mentionSuggestions("an", people).map((p) => p.id)).toEqual(["ana", "ana-lee"]);
    expect(mentionSuggestions("l", people).map((p) => p.id)).toEqual(["ana-lee", "kwame"]);
    expect(mentionSuggestions("ILSE M", people).map((p) => p.id)).toEqual(["ilse"]);
    expect(mentionSuggestions("", people)).toHaveLength(4);
    expect(mentionSuggestions("zed", people)).toEqual([]);
    expect(mentionSuggestions("jose", [{ id: "j", name: "José Ortega" }]).map((p) => p.id)).toEqual(["j"]);
  });

  it("when a name is chosen, then it replaces what was typed and the caret goes after it", () => {
    expect(completeMention("Thanks @Kw, see", 10, "Kwame Lindqvist")).toEqual({ text: "Thanks @Kwame Lindqvist, see", caret: 23 });
    expect(completeMention("@il", 3, "Ilse Marchetti")).toEqual({ text: "@Ilse Marchetti ", caret: 16 });
    expect(mentionedIn(completeMention("@il", 3, "Ilse Marchetti").text, people)).toEqual(["ilse"]);
  });
});
