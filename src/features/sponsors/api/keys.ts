/** Query keys of the sponsors feature, general to specific, so a mutation can invalidate at any level. */
export const sponsorKeys = {
  all: ["sponsors"] as const,
  channel: (channelId: string) => [...sponsorKeys.all, channelId] as const,
  sponsors: (channelId: string) => [...sponsorKeys.channel(channelId), "sponsors"] as const,
  sponsor: (channelId: string, sponsorId: string) => [...sponsorKeys.sponsors(channelId), sponsorId] as const,
  templates: (channelId: string) => [...sponsorKeys.channel(channelId), "templates"] as const,
  deals: (channelId: string) => [...sponsorKeys.channel(channelId), "deals"] as const,
  episodeDeals: (channelId: string, episodeId: string) => [...sponsorKeys.deals(channelId), "episode", episodeId] as const,
  desks: (channelId: string) => [...sponsorKeys.channel(channelId), "desk"] as const,
  desk: (channelId: string, filter: { sponsorId?: string; episodeId?: string }) => [...sponsorKeys.desks(channelId), filter] as const,
  settings: (channelId: string) => [...sponsorKeys.channel(channelId), "settings"] as const,
  review: (token: string) => [...sponsorKeys.all, "review", token] as const,
  report: (channelId: string, dealId: string) => [...sponsorKeys.deals(channelId), "report", dealId] as const,
  sponsorReport: (token: string) => [...sponsorKeys.all, "sponsor-report", token] as const,
  invoices: (channelId: string, dealId: string) => [...sponsorKeys.deals(channelId), "invoices", dealId] as const,
  overdueInvoices: (channelId: string) => [...sponsorKeys.channel(channelId), "overdue-invoices"] as const,
  cutPlayer: (channelId: string, dealId: string) => [...sponsorKeys.deals(channelId), "cut-player", dealId] as const,
};

export const channelBase = (channelId: string) => `/api/channels/${channelId}`;
