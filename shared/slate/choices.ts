import type { EpisodeFields } from "./schemas";

/**
 * The episode's choices and labels, kept apart from its schemas: the slate and the episode page read
 * them on their first paint, and importing them from ./schemas would load zod with those pages.
 */

/** Where a challenge came from. */
export const origins = ["viewer", "idea", "sponsor"] as const;
export type Origin = (typeof origins)[number];
export const originLabels: Record<Origin, string> = {
  viewer: "A viewer's suggestion",
  idea: "Our own idea",
  sponsor: "A sponsor's request",
};

/** Offered in the form; any ISO 4217 code is accepted. */
export const commonCurrencies = ["EUR", "USD", "GBP", "NOK", "SEK", "DKK", "CHF", "CAD", "AUD", "NZD", "JPY", "PLN"] as const;

/** The board's filters, by their names in the page's URL and the API's query string. */
export const boardFilterKeys = ["owner", "tag", "sponsor", "risk", "archived"] as const;

export const emptyEpisodeFields: EpisodeFields = {
  title: "",
  question: "",
  origin: "idea",
  originLink: "",
  whyWorthIt: "",
  ownerId: "",
  tags: [],
  budgetAmount: "",
  budgetCurrency: "",
  targetPublishDate: "",
};
