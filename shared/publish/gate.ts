import { hasDisclosure } from "../sponsors/disclosure";
import type { GateProblem } from "../slate/gates";
import { checkChapterText } from "./chapters";
import { beforeFold, type PaidMention } from "./description";
import { checkDescription, checkTitle } from "./limits";

/** What the publish gate reads: the package as saved, and what the episode's deals ask of it. */
export interface GateInput {
  chosenTitle: string | null;
  description: string;
  chapters: string;
  /** null when no thumbnail is chosen; else the chosen picture's broken rules. */
  thumbnailProblems: string[] | null;
  mentions: PaidMention[];
  /** Sponsor approvals still open, each in plain words (from the deals). */
  openApprovals: string[];
}

const problem = (code: string, message: string): GateProblem => ({ code: `publish.${code}`, message });

function mentionProblems(description: string, mention: PaidMention): GateProblem[] {
  const problems: GateProblem[] = [];
  if (!hasDisclosure(description, mention.disclosure)) {
    problems.push(problem("no_disclosure", `${mention.company}: the description has no disclosure line.`));
  } else if (!hasDisclosure(beforeFold(description), mention.disclosure)) {
    problems.push(problem("disclosure_below_fold", `${mention.company}: the disclosure is not in the description's first lines, where viewers see it without opening it.`));
  }
  if (mention.link && !description.includes(mention.link)) problems.push(problem("no_sponsor_link", `${mention.company}: the description lacks the deal's link (${mention.link}).`));
  return problems;
}

/** Everything missing before the video goes live; each asks for confirmation with a reason. */
export function publishGateProblems(input: GateInput): GateProblem[] {
  const problems: GateProblem[] = [];
  if (input.chosenTitle === null) problems.push(problem("no_title", "No title is chosen."));
  else problems.push(...checkTitle(input.chosenTitle).problems.map((m) => problem("title", m)));
  problems.push(...checkDescription(input.description).problems.map((m) => problem("description", m)));
  for (const mention of input.mentions) problems.push(...mentionProblems(input.description, mention));
  problems.push(...checkChapterText(input.chapters).problems.map((m) => problem("chapters", m)));
  if (input.thumbnailProblems === null) problems.push(problem("no_thumbnail", "No thumbnail is chosen."));
  else problems.push(...input.thumbnailProblems.map((m) => problem("thumbnail", m)));
  problems.push(...input.openApprovals.map((m) => problem("sponsor_approval", m)));
  return problems;
}
