import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SponsorReportView } from "@shared/sponsors/report";
import { api } from "../../../lib/api-client";
import { sponsorKeys } from "./keys";

export interface SponsorReportPage {
  report: SponsorReportView;
  pdfUrl: string | null;
  expiresAt: string;
}

export const sponsorReportQueryOptions = (token: string) =>
  queryOptions({ queryKey: sponsorKeys.sponsorReport(token), queryFn: () => api<SponsorReportPage>(`/api/sponsor-report/${encodeURIComponent(token)}`), staleTime: 0 });

export const useSponsorReport = (token: string) => useQuery(sponsorReportQueryOptions(token));
