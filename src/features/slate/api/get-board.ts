import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import { boardFilterKeys } from "@shared/slate/choices";
import type { Board, BoardFilters } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export function boardQueryString(filters: BoardFilters): string {
  const params = new URLSearchParams();
  for (const key of boardFilterKeys) {
    const value = filters[key];
    if (value) params.set(key, value);
  }
  const text = params.toString();
  return text ? `?${text}` : "";
}

export const boardQueryOptions = (channelId: string, filters: BoardFilters) =>
  queryOptions({
    queryKey: slateKeys.board(channelId, filters),
    queryFn: ({ signal }) => api<Board>(`/api/channels/${channelId}/episodes${boardQueryString(filters)}`, { signal }),
    // Changing a filter keeps the old board on screen until the new one arrives.
    placeholderData: keepPreviousData,
  });

export const useBoard = (channelId: string, filters: BoardFilters) => useQuery(boardQueryOptions(channelId, filters));
