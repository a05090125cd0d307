import type { ReactNode } from "react";
import { figureKinds, figureLabels, figureSeries, formatFigure } from "@shared/publish/figures";
import { deliverableStatusLabels } from "@shared/sponsors/deliverables";
import type { SponsorReportView } from "@shared/sponsors/report";
import { placementLabels } from "@shared/sponsors/schemas";
import { FiguresChart } from "../../../components/chart/FiguresChart";
import { formatDay, formatInstantNamingZone, formatMoney, formatSeconds } from "../../../lib/format";

/** A part of the report; on paper a short one stays whole, a long one may break between its blocks but never right after its heading. */
function Part({ title, children, keepWhole = true }: { title: string; children: ReactNode; keepWhole?: boolean }) {
  return (
    <section className={`space-y-2 ${keepWhole ? "break-inside-avoid" : ""}`}>
      <h2 className="break-after-avoid border-b border-ply-300 pb-1 text-base font-semibold text-graphite-900">{title}</h2>
      {children}
    </section>
  );
}

function Segment({ report }: { report: SponsorReportView }) {
  const { segment } = report;
  const measured = segment.measuredSeconds;
  const against = measured === null ? null : measured - segment.contractedSeconds;
  return (
    <dl className="grid grid-cols-1 gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
      <dt className="text-graphite-500">Placement</dt>
      <dd>{placementLabels[segment.placement]}</dd>
      <dt className="text-graphite-500">Running time in the cut</dt>
      <dd>
        {measured === null ? "not measured in the cut" : formatSeconds(measured)} against {formatSeconds(segment.contractedSeconds)} agreed
        {against !== null && against !== 0 && ` (${formatSeconds(Math.abs(against))} ${against > 0 ? "longer" : "shorter"})`}
      </dd>
      <dt className="text-graphite-500">Talking points</dt>
      <dd>
        <ul>
          {report.talkingPoints.map((p) => (
            <li key={p.point}>
              {p.covered ? "✓ Covered: " : "✗ Not found in the script: "}
              {p.point}
            </li>
          ))}
          {report.talkingPoints.length === 0 && <li>None were required.</li>}
        </ul>
      </dd>
      {report.link && (
        <>
          <dt className="text-graphite-500">Link</dt>
          <dd className="break-all">{report.link}</dd>
        </>
      )}
      {report.code && (
        <>
          <dt className="text-graphite-500">Code</dt>
          <dd>{report.code}</dd>
        </>
      )}
    </dl>
  );
}

function Figures({ report }: { report: SponsorReportView }) {
  if (report.figures.length === 0) return <p className="text-sm">No figures have been entered yet.</p>;
  return (
    <>
      <table className="w-full break-inside-avoid text-left text-sm">
        <caption className="sr-only">The video&apos;s figures by day after go-live</caption>
        <thead>
          <tr className="border-b border-ply-300">
            <th scope="col" className="py-1 pr-2">Day</th>
            {figureKinds.map((k) => (
              <th key={k} scope="col" className="py-1 pr-2">{figureLabels[k]}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {report.figures.map((f) => (
            <tr key={f.day} className="border-b border-ply-200">
              <th scope="row" className="py-1 pr-2 font-medium">Day {f.day}{f.dueOn && <span className="block text-xs font-normal text-graphite-500">{formatDay(f.dueOn)}</span>}</th>
              {figureKinds.map((k) => (
                <td key={k} className="py-1 pr-2 tabular-nums">{f.values[k] == null ? "—" : formatFigure(f.values[k])}</td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <FiguresChart series={figureSeries(report.figures)} format={formatFigure} subject={report.episodeTitle ?? "the video"} />
    </>
  );
}

/** A figures item the report itself delivers reads "in this report" until sending it marks the item done, so the PDF made before sending never calls it not started. */
const statusOf = (d: SponsorReportView["deliverables"][number]) => (d.kind === "report" && d.status !== "done" ? "in this report" : deliverableStatusLabels[d.status]);

/** The report itself: the same on the members' page, the sponsor's page and the PDF printed from it. */
export function ReportBody({ report }: { report: SponsorReportView }) {
  return (
    <article className="space-y-5 rounded-xl border border-ply-300 bg-white p-5 text-graphite-900 shadow-sm print:border-0 print:p-0 print:shadow-none sm:p-8">
      <header className="space-y-1">
        <p className="text-sm text-graphite-500">{report.channelName} · report for {report.company}</p>
        <h1 className="text-xl font-bold">{report.episodeTitle ?? "The video"}</h1>
        <p className="text-sm">
          {report.publishedAt ? `Live since ${formatInstantNamingZone(report.publishedAt, "UTC")}` : "Not live yet"}
          {report.videoUrl && <span className="block break-all">{report.videoUrl}</span>}
        </p>
        {report.money && <p className="text-sm text-graphite-700">Fee (members only, never sent): {formatMoney(report.money.fee, report.money.currency)}</p>}
      </header>
      <Part title="Deliverables and dates">
        <ul className="space-y-1 text-sm">
          {report.deliverables.map((d) => (
            <li key={`${d.kind}-${d.title}`} className="flex flex-wrap justify-between gap-2">
              <span>{d.title}</span>
              <span className="text-graphite-700">{d.dueDate ? formatDay(d.dueDate) : "no date"} · {statusOf(d)}</span>
            </li>
          ))}
        </ul>
      </Part>
      <Part title="The segment">
        <Segment report={report} />
      </Part>
      <Part title="Disclosure as published">
        {report.disclosure.asPublished ? (
          <blockquote className="border-l-4 border-amber-cut pl-3 text-sm">{report.disclosure.asPublished}</blockquote>
        ) : (
          <p className="text-sm">{report.disclosure.wording ? `The published description does not carry the agreed wording ("${report.disclosure.wording}").` : "The deal names no disclosure wording."}</p>
        )}
      </Part>
      <Part title="Figures" keepWhole={false}>
        <Figures report={report} />
      </Part>
    </article>
  );
}
