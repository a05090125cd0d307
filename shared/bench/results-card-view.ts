/** What the bench section reads about the episode's results card. */
export type ResultsCardState = "queued" | "drawing" | "ready" | "failed";

export interface CardFile {
  fileName: string;
  url: string;
}

export interface ResultsCardView {
  state: ResultsCardState;
  failure: string | null;
  updatedAt: string;
  /** The latest finished picture (kept while a new one is drawn); links are short-lived. */
  png: CardFile | null;
  svg: CardFile | null;
}
