import type { DealTemplate } from "../../shared/sponsors/schemas";
import type { Database } from "../db/client";
import { notFound, staleSave } from "../http/app-error";
import { starterTemplate } from "../../shared/sponsors/starter-template";
import { insertTemplate, listTemplates, updateTemplate } from "./sponsors.repository";

/** A template's name and items, against the version the editor saw. */
export async function changeTemplate(db: Database, channelId: string, templateId: string, version: number, input: Pick<DealTemplate, "name" | "items">): Promise<DealTemplate> {
  const row = await updateTemplate(db, channelId, templateId, version, input);
  if (row) return row;
  const current = (await listTemplates(db, channelId)).find((t) => t.id === templateId);
  throw current ? staleSave("template", current) : notFound("Template");
}

/** Every new channel starts with one template to adjust rather than an empty list. */
export async function startWithDealTemplate(db: Database, channelId: string): Promise<void> {
  await insertTemplate(db, channelId, starterTemplate);
}
