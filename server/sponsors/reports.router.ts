import { sendReportSchema } from "../../shared/sponsors/report";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, publicAccess, type RouteSpec } from "../http/route-table";
import { parseBody } from "../http/validate";
import { memberReport, reportForLink, requestPdf, sendReport, type ReportContext } from "./reports.service";

const report = "/api/channels/:channelId/deals/:dealId/report";

/** The sponsor's report: read by members, made and sent by the roles that run deliverables; the sponsor's page is public, its signed token the key. */
export function reportRoutes(ctx: ReportContext): RouteSpec[] {
  return [
    {
      method: "get",
      path: report,
      access: channelAccess("sponsors", "R"),
      handler: async (req, res) => res.json(await memberReport(ctx, callerOf(req), idOf(req, "dealId"))),
    },
    {
      method: "post",
      path: `${report}/pdf`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => res.status(202).json(await requestPdf(ctx, callerOf(req), idOf(req, "dealId"))),
    },
    {
      method: "post",
      path: `${report}/send`,
      access: channelAccess("deliverables", "W"),
      handler: async (req, res) => {
        const input = parseBody(sendReportSchema, req.body);
        res.json(await sendReport(ctx, callerOf(req), idOf(req, "dealId"), input));
      },
    },
    {
      method: "get",
      path: "/api/sponsor-report/:token",
      access: publicAccess,
      handler: async (req, res) => res.json(await reportForLink(ctx, String(req.params.token))),
    },
  ];
}
