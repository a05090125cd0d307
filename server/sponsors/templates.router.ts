import { templateInputSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { deleteTemplate, insertTemplate, listTemplates } from "./sponsors.repository";
import { changeTemplate } from "./templates.service";

const list = "/api/channels/:channelId/deal-templates";

/** Deal templates: the items a new deal starts with (the spec's "deliverables" row). */
export function templateRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("deliverables", "R");
  const write = channelAccess("deliverables", "W");
  return [
    { method: "get", path: list, access: read, handler: async (req, res) => res.json({ templates: await listTemplates(db, callerOf(req).channelId) }) },
    {
      method: "post",
      path: list,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(templateInputSchema, req.body);
        res.status(201).json({ template: await insertTemplate(db, callerOf(req).channelId, input) });
      },
    },
    {
      method: "put",
      path: `${list}/:templateId`,
      access: write,
      handler: async (req, res) => {
        const { version, input } = parseVersioned(templateInputSchema, req.body);
        res.json({ template: await changeTemplate(db, callerOf(req).channelId, idOf(req, "templateId"), version, input) });
      },
    },
    {
      method: "delete",
      path: `${list}/:templateId`,
      access: write,
      handler: async (req, res) => {
        // Deals made from a template keep their items: deleting it changes no deal.
        if (!(await deleteTemplate(db, callerOf(req).channelId, idOf(req, "templateId")))) throw notFound("Template");
        res.status(204).end();
      },
    },
  ];
}
