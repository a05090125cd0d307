import { useParams, useSearchParams } from "react-router-dom";
import { QueryState } from "../../../components/States";
import { Wordmark } from "../../../components/Wordmark";
import { formatInstantNamingZone } from "../../../lib/format";
import { useSponsorReport } from "../api/get-sponsor-report";
import { ReportBody } from "./ReportBody";

const invalidLink = { title: "This report link doesn't open", text: "Check that the whole address was copied from the mail, or ask the channel for a new link." };

/** The sponsor's contact, without an account, reads the report and downloads its PDF; the PDF job prints this page (?print=1). */
export function SponsorReportPage() {
  const { token = "" } = useParams();
  const [search] = useSearchParams();
  const printing = search.has("print");
  const query = useSponsorReport(token);
  return (
    <main className={printing ? "bg-white" : "min-h-screen bg-ply-100 px-4 py-4 sm:py-8"}>
      <div className="mx-auto flex max-w-3xl flex-col gap-6">
        <Wordmark className="text-xl" />
        <QueryState query={query} loading="Opening the report…" missing={invalidLink}>
          {(page) => (
            <div data-report-ready className="space-y-4">
              {!printing && page.pdfUrl && (
                <p className="text-sm">
                  <a className="font-semibold underline" href={page.pdfUrl}>
                    Download the report as PDF
                  </a>{" "}
                  · the link works until {formatInstantNamingZone(page.expiresAt, "UTC")}.
                </p>
              )}
              <ReportBody report={page.report} />
            </div>
          )}
        </QueryState>
        {!printing && <p className="text-xs text-graphite-500">This page was sent to you by a channel that plans its videos with Kerf. You don&apos;t need an account to read it.</p>}
      </div>
    </main>
  );
}
