import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ReportFileView, SponsorReportView } from "@shared/sponsors/report";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export interface MemberReport {
  report: SponsorReportView;
  file: ReportFileView | null;
}

export const reportPath = (channelId: string, dealId: string) => `${channelBase(channelId)}/deals/${dealId}/report`;

export const reportQueryOptions = (channelId: string, dealId: string) =>
  queryOptions({
    queryKey: sponsorKeys.report(channelId, dealId),
    queryFn: () => api<MemberReport>(reportPath(channelId, dealId)),
    // The figures and the published description come from the publish package.
    meta: { follows: ["publish", "episode"] },
    // While the PDF is being made, look again every two seconds until the job has finished.
    refetchInterval: (query) => (query.state.data?.file?.state === "queued" ? 2000 : false),
  });

export const useReport = (channelId: string, dealId: string) => useQuery(reportQueryOptions(channelId, dealId));
