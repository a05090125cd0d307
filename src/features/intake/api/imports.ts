import type { ColumnMapping, ImportPreview } from "@shared/intake/schemas";
import { api } from "../../../lib/api-client";
import { useIntakeMutation } from "./intake-mutation";
import { intakeBase } from "./keys";

export const previewImport = (channelId: string, csv: string, mapping?: ColumnMapping) =>
  api<{ preview: ImportPreview }>(`${intakeBase(channelId)}/imports/preview`, { method: "POST", body: { csv, mapping } }).then((r) => r.preview);

export const useImportFile = (channelId: string) =>
  useIntakeMutation(channelId, (body: { csv: string; mapping: ColumnMapping }) => api<{ added: number; skipped: number }>(`${intakeBase(channelId)}/imports`, { method: "POST", body }));
