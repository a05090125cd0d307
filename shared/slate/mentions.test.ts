import { describe, expect, it } from "vitest";
import { mentionedIn } from "./mentions";

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
