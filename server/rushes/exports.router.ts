import { z } from "zod";
import { edlRateSchema } from "../../shared/rushes/exports/edl-rates";
import { footageQuerySchema } from "../../shared/rushes/footage-query";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseId } from "../http/validate";
import { edlRates, streamExport, streamZip, writeEdl } from "./exports.service";
import type { RushesContext } from "./rushes.context";

const base = "/api/channels/:channelId/exports";

const idsSchema = z.object({ ids: z.string().max(200 * 37, "Too many clips in one zip.") });
const edlQuerySchema = footageQuerySchema.extend({ rate: edlRateSchema.optional() });

/** The footage list's exports: CSV, EDL and OTIO of the filter, the filter's frame rates, and a zip of chosen clips. */
export function exportRoutes(ctx: RushesContext): RouteSpec[] {
  const read = channelAccess("footage", "R");
  return [
    ...(["csv", "otio"] as const).map(
      (kind): RouteSpec => ({
        method: "get",
        path: `${base}/footage.${kind}`,
        access: read,
        handler: async (req, res) => streamExport(ctx, callerOf(req), parseBody(footageQuerySchema, req.query), kind, res),
      }),
    ),
    {
      method: "get",
      path: `${base}/footage.edl`,
      access: read,
      handler: async (req, res) => {
        const { rate, ...q } = parseBody(edlQuerySchema, req.query);
        await writeEdl(ctx, callerOf(req), q, rate, res);
      },
    },
    {
      method: "get",
      path: `${base}/edl-rates`,
      access: read,
      handler: async (req, res) => {
        res.json(await edlRates(ctx, callerOf(req), parseBody(footageQuerySchema, req.query)));
      },
    },
    {
      method: "get",
      path: `${base}/footage.zip`,
      access: read,
      handler: async (req, res) => {
        const { ids } = parseBody(idsSchema, req.query);
        // The ids travel in the query, not the path: the guard has not seen them, the service checks them.
        const clipIds = ids.split(",").filter(Boolean).map((id) => parseId(id, "Clip"));
        await streamZip(ctx, callerOf(req), clipIds, res);
      },
    },
  ];
}
