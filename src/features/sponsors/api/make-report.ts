import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ReportFileView } from "@shared/sponsors/report";
import { api } from "../../../lib/api-client";
import { type MemberReport, reportPath } from "./get-report";
import { sponsorKeys } from "./keys";

/** Asks for the PDF, or mails the report: the answer's file replaces the cached one; sending settles the report items. */
export function useReportAction(channelId: string, dealId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (action: "pdf" | "send") => api<{ file: ReportFileView; url?: string }>(`${reportPath(channelId, dealId)}/${action}`, { method: "POST", body: {} }),
    onSuccess: ({ file }, action) => {
      queryClient.setQueryData(sponsorKeys.report(channelId, dealId), (old: MemberReport | undefined) => old && { ...old, file });
      if (action === "send") void queryClient.invalidateQueries({ queryKey: sponsorKeys.deals(channelId) });
    },
  });
}
