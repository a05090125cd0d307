import { useParams } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { formatInstant, formatSize } from "../../../lib/format";
import { useChannel, useTimeZone } from "../../../lib/session";
import { useReport } from "../api/get-report";
import { useReportAction } from "../api/make-report";
import { ReportBody } from "./ReportBody";

/** A deal's report to its sponsor: read by members; made into a PDF and mailed by the roles that run deliverables. */
export function ReportPage() {
  const { channelId = "", dealId = "" } = useParams();
  const query = useReport(channelId, dealId);
  const { role } = useChannel();
  const act = useReportAction(channelId, dealId);
  const zone = useTimeZone();
  const canSend = roleMay(role, "deliverables", "W");
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <QueryState query={query} loading="Loading the report…">
        {({ report, file }) => (
          <>
            <section aria-labelledby="report-file" className="space-y-2 rounded-md border border-ply-300 bg-white p-4">
              <h2 id="report-file" className="font-semibold">The sponsor&apos;s report</h2>
              {!file && <p className="text-sm">No PDF yet.</p>}
              {file?.state === "queued" && <p role="status" className="text-sm">Making the PDF…</p>}
              {file?.state === "failed" && <Notice kind="error">{file.failure}</Notice>}
              {file?.state === "ready" && (
                <p role="status" className="text-sm">
                  PDF ready: {file.pages ?? "?"} page{file.pages === 1 ? "" : "s"}, {formatSize(file.sizeBytes ?? 0)}.{" "}
                  {file.pdfUrl && <a className="underline" href={file.pdfUrl}>Download the PDF</a>}
                </p>
              )}
              {file?.sentAt && <p className="text-sm">Sent to {file.sentTo} on {formatInstant(file.sentAt, zone)}; the link works until {formatInstant(file.linkExpiresAt!, zone)}.</p>}
              {act.error && <Notice kind="error">{act.error.message}</Notice>}
              {canSend && (
                <div className="flex flex-wrap gap-2">
                  <Button type="button" tone="quiet" busy={act.isPending && act.variables === "pdf"} onClick={() => act.mutate("pdf")}>
                    {file ? "Make the PDF again" : "Make the PDF"}
                  </Button>
                  <Button type="button" disabled={file?.state !== "ready"} busy={act.isPending && act.variables === "send"} onClick={() => act.mutate("send")}>
                    Mail it to the sponsor&apos;s contact
                  </Button>
                </div>
              )}
            </section>
            <ReportBody report={report} />
          </>
        )}
      </QueryState>
    </div>
  );
}
