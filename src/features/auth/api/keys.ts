/** Query keys of the account's own pages, general to specific. */
export const accountKeys = {
  all: ["account"] as const,
  settings: () => [...accountKeys.all, "settings"] as const,
  sessions: () => [...accountKeys.all, "sessions"] as const,
};
