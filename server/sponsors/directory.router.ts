import { contactInputSchema, sponsorInputSchema } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import { callerOf, idOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { parseBody, parseVersioned } from "../http/validate";
import { changeContact, changeSponsor, contactOf, sponsorDetail, sponsorSummaries } from "./directory.service";
import { deleteContact, insertContact, insertSponsor } from "./sponsors.repository";

const list = "/api/channels/:channelId/sponsors";
const sponsor = `${list}/:sponsorId`;

/** The sponsor directory: companies and their contacts (the spec's "sponsors, deals" row). */
export function directoryRoutes(db: Database): RouteSpec[] {
  const read = channelAccess("sponsors", "R");
  const write = channelAccess("sponsors", "W");
  return [
    { method: "get", path: list, access: read, handler: async (req, res) => res.json({ sponsors: await sponsorSummaries(db, callerOf(req).channelId) }) },
    {
      method: "post",
      path: list,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(sponsorInputSchema, req.body);
        const row = await insertSponsor(db, callerOf(req).channelId, input);
        res.status(201).json({ sponsor: { id: row.id, company: row.company, website: row.website, notes: row.notes, contacts: [], dealCount: 0, version: row.version } });
      },
    },
    { method: "get", path: sponsor, access: read, handler: async (req, res) => res.json({ sponsor: await sponsorDetail(db, callerOf(req), idOf(req, "sponsorId")) }) },
    {
      method: "patch",
      path: sponsor,
      access: write,
      handler: async (req, res) => {
        const { version, input } = parseVersioned(sponsorInputSchema, req.body);
        res.json({ sponsor: await changeSponsor(db, callerOf(req), idOf(req, "sponsorId"), version, input) });
      },
    },
    {
      method: "post",
      path: `${sponsor}/contacts`,
      access: write,
      handler: async (req, res) => {
        const input = parseBody(contactInputSchema, req.body);
        res.status(201).json({ contact: contactOf(await insertContact(db, callerOf(req).channelId, idOf(req, "sponsorId"), input)) });
      },
    },
    {
      method: "patch",
      path: `${sponsor}/contacts/:contactId`,
      access: write,
      handler: async (req, res) => {
        const { version, input } = parseVersioned(contactInputSchema, req.body);
        res.json({ contact: await changeContact(db, callerOf(req), idOf(req, "sponsorId"), idOf(req, "contactId"), version, input) });
      },
    },
    {
      method: "delete",
      path: `${sponsor}/contacts/:contactId`,
      access: write,
      handler: async (req, res) => {
        if (!(await deleteContact(db, callerOf(req).channelId, idOf(req, "sponsorId"), idOf(req, "contactId")))) throw notFound("Contact");
        res.status(204).end();
      },
    },
  ];
}
