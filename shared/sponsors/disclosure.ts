import { normalise } from "./read";

/**
 * The published guidance Kerf's disclosure check follows. The check is a reminder, not legal advice:
 * the law of the country where the video is seen governs.
 */
export const disclosureGuidance = [
  {
    where: "United States",
    title: "FTC, Guides Concerning the Use of Endorsements and Testimonials in Advertising, 16 CFR Part 255",
    point:
      "A material connection (payment, free products) must be disclosed clearly and conspicuously (§ 255.5). FTC staff guidance for creators: in a video, say it in the video itself, not only in the description.",
  },
  {
    where: "United Kingdom",
    title: "CAP Code (UK Code of Non-broadcast Advertising and Direct & Promotional Marketing), section 2",
    point: "Marketing must be obviously identifiable as such; the CAP/CMA influencers' guide asks for a clear label such as \"Ad\" up front.",
  },
] as const;

export const DISCLOSURE_LAW_NOTE =
  "Kerf checks that a disclosure is there; it does not give legal advice. The law of the country where the video is seen governs, and it may ask for more.";

/**
 * Plain words that say "this is paid" on their own, as the FTC's creator guidance ("ad", "sponsored")
 * and the CAP/CMA guide ("Ad", "#ad") use them. Matched as whole words, so "adapter" is not "ad".
 */
export const plainDisclosureLabels = ["ad", "#ad", "advert", "advertisement", "sponsored", "sponsor", "paid partnership", "paid promotion", "paid for by"] as const;

function containsWords(text: string, phrase: string): boolean {
  const needle = normalise(phrase);
  return needle.length > 0 && ` ${normalise(text)} `.includes(` ${needle} `);
}

/** True when the text holds the deal's own disclosure wording or a plain label. */
export function hasDisclosure(text: string, wording: string | null): boolean {
  if (wording && containsWords(text, wording)) return true;
  return plainDisclosureLabels.some((label) => containsWords(text, label));
}

export interface DisclosureCheck {
  inSegment: boolean;
  inDescription: boolean;
}

/** Where a paid deal's disclosure is present: the spoken segment (script) and the video's description. */
export function checkDisclosure(input: { script: string; description: string; wording: string | null }): DisclosureCheck {
  return { inSegment: hasDisclosure(input.script, input.wording), inDescription: hasDisclosure(input.description, input.wording) };
}
