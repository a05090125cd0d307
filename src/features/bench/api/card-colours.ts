import { queryOptions, useQuery } from "@tanstack/react-query";
import type { CardColours } from "@shared/bench/card-colours";
import { api } from "../../../lib/api-client";
import { useBenchMutation } from "./bench-mutation";
import { benchKeys } from "./keys";

type ColoursAnswer = { colours: CardColours; own: boolean };
const coloursPath = (channelId: string) => `/api/channels/${channelId}/results-card-colours`;

/** The channel's results-card colours (Kerf's own until someone sets them). */
export const cardColoursQueryOptions = (channelId: string) =>
  queryOptions({ queryKey: benchKeys.cardColours(channelId), queryFn: () => api<ColoursAnswer>(coloursPath(channelId)) });

export const useCardColours = (channelId: string) => useQuery(cardColoursQueryOptions(channelId));

/** Saves the channel's card colours; null goes back to Kerf's own. */
export const useSaveCardColours = (channelId: string) =>
  useBenchMutation(channelId, (colours: CardColours | null) => api<ColoursAnswer>(coloursPath(channelId), { method: "PUT", body: { colours } }));
