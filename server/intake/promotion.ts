import type { IdeaView, SuggestionView } from "../../shared/intake/schemas";
import type { ViewerEpisode } from "../seams/episode-makers";

const cut = (text: string, max: number) => {
  const line = text.replace(/\s+/g, " ").trim();
  return line.length <= max ? line : `${line.slice(0, max - 1).trimEnd()}…`;
};
const day = (iso: string) => iso.slice(0, 10);

/** What an idea carries into its episode: the wording, who asked and when, their words and links. */
export function viewerEpisode(idea: IdeaView, suggestions: SuggestionView[], ideaLink: string): ViewerEpisode {
  const links = [...new Set(suggestions.map((s) => s.link).filter((l): l is string => !!l))];
  const asked = idea.people === 1 ? "Asked by 1 viewer" : `Asked by ${idea.people} viewers`;
  const when = day(idea.firstAsked) === day(idea.lastAsked) ? `on ${day(idea.firstAsked)}` : `between ${day(idea.firstAsked)} and ${day(idea.lastAsked)}`;
  const lines = [`${asked} ${when} (${idea.suggestions} suggestion${idea.suggestions === 1 ? "" : "s"}).`, "", "In their words:", ...idea.samples.map((s) => `- ${cut(s, 200)}`)];
  if (links.length > 0) lines.push("", "Links:", ...links.slice(0, 5).map((l) => `- ${l}`));
  lines.push("", `The idea in Kerf: ${ideaLink}`);
  return { title: cut(idea.wording, 120), question: cut(idea.wording, 200), originLink: links[0] ?? ideaLink, whyWorthIt: lines.join("\n").slice(0, 2000) };
}
