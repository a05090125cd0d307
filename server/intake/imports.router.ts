import type { Database } from "../db/client";
import { callerOf } from "../http/guards";
import { channelAccess, type RouteSpec } from "../http/route-table";
import { importFile, previewImport } from "./imports.service";

const imports = "/api/channels/:channelId/intake/imports";
/** A comments file of a few thousand rows, as text; larger files are split (CSV_MAX_CHARS). */
const FILE_BODY = 5 * 1024 * 1024;

/** Importing exported comments: preview first (nothing written), then the whole file in one transaction. */
export function importRoutes(db: Database): RouteSpec[] {
  const access = channelAccess("intakePage", "W", "Only the owner and producers import comment files.");
  return [
    { method: "post", path: `${imports}/preview`, access, bodyLimit: FILE_BODY, handler: async (req, res) => res.json({ preview: await previewImport(db, callerOf(req), req.body) }) },
    { method: "post", path: imports, access, bodyLimit: FILE_BODY, handler: async (req, res) => res.status(201).json(await importFile(db, callerOf(req), req.body)) },
  ];
}
