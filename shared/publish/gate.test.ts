import { describe, expect, it } from "vitest";
import { buildDescription } from "./description";
import { publishGateProblems } from "./gate";

const mention = { company: "Ohmwright Cells", disclosure: "Paid partnership with Ohmwright Cells.", link: "https://ohmwright.example/bench", code: "BENCH10" };
const chapters = "0:00 Intro\n0:30 Build\n2:00 Verdict";

describe("the description draft", () => {
  it("puts each disclosure first and carries link, code, chapters, parts and credits", () => {
    const text = buildDescription({
      summary: "Three packs on one bench.",
      mentions: [mention],
      chapters: [{ startSeconds: 0, title: "Intro" }],
      parts: [{ name: "XT60 plug", boughtFrom: "Corner Hobby" }],
      credits: [{ role: "Editor", names: ["Ida Brenn"] }],
    });
    expect(text.split("\n")[0]).toBe("Paid partnership with Ohmwright Cells.");
    expect(text).toContain("Ohmwright Cells: https://ohmwright.example/bench");
    expect(text).toContain("Code BENCH10 at Ohmwright Cells");
    expect(text).toContain("0:00 Intro");
    expect(text).toContain("XT60 plug: Corner Hobby");
    expect(text).toContain("Editor: Ida Brenn");
  });
});

describe("the publish gate", () => {
  const ready = {
    chosenTitle: "Which pack lasts?",
    description: buildDescription({ summary: "s", mentions: [mention], chapters: [], parts: [], credits: [] }),
    chapters,
    thumbnailProblems: [],
    mentions: [mention],
    openApprovals: [],
  };
  it("passes a complete package", () => expect(publishGateProblems(ready)).toEqual([]));
  it("names each missing essential", () => {
    const codes = publishGateProblems({ ...ready, chosenTitle: null, description: "nothing here", chapters: "", thumbnailProblems: null, openApprovals: ["Final approval is open."] }).map((p) => p.code);
    expect(codes).toEqual(["publish.no_title", "publish.no_disclosure", "publish.no_sponsor_link", "publish.chapters", "publish.no_thumbnail", "publish.sponsor_approval"]);
  });
  it("wants the disclosure before the fold", () => {
    const late = `a\nb\nc\nd\n${mention.disclosure} ${mention.link}`;
    expect(publishGateProblems({ ...ready, description: late }).map((p) => p.code)).toEqual(["publish.disclosure_below_fold"]);
  });
});
