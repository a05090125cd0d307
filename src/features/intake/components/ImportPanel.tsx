import { useState } from "react";
import type { ColumnMapping, ImportPreview } from "@shared/intake/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField } from "../../../components/form-fields";
import { previewImport, useImportFile } from "../api/imports";

const roles: { key: keyof ColumnMapping; label: string }[] = [
  { key: "text", label: "Comment text" },
  { key: "author", label: "Who wrote it" },
  { key: "link", label: "Link to the comment" },
  { key: "postedAt", label: "When it was posted" },
  { key: "commentId", label: "The comment's id" },
];

/** A CSV of comments exported from a video platform: map its columns, see what would be added, then import it whole. */
export function ImportPanel({ channelId }: { channelId: string }) {
  const [csv, setCsv] = useState<string | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [checking, setChecking] = useState(false);
  const run = useImportFile(channelId);

  async function check(text: string, chosen?: ColumnMapping) {
    setChecking(true);
    setProblem(null);
    try {
      const found = await previewImport(channelId, text, chosen);
      setPreview(found);
      setMapping(found.mapping ?? { text: "", author: "", link: "", postedAt: "", commentId: "" });
    } catch (error) {
      setPreview(null);
      setProblem((error as Error).message);
    } finally {
      setChecking(false);
    }
  }

  async function choose(file: File | undefined) {
    run.reset();
    if (!file) return;
    const text = await file.text();
    setCsv(text);
    await check(text);
  }

  return (
    <section className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4" aria-labelledby="import-heading">
      <h2 id="import-heading" className="font-semibold">
        Import exported comments
      </h2>
      <div className="flex flex-col gap-1">
        <label htmlFor="import-file" className="text-sm font-medium text-graphite-700">
          CSV file of comments
        </label>
        <input id="import-file" type="file" accept=".csv,text/csv" className="max-w-full text-sm" onChange={(e) => void choose(e.target.files?.[0])} />
        <p className="text-xs text-graphite-500">Nothing is written until you press Import. Importing the same comments again adds nothing.</p>
      </div>
      {checking && <p role="status">Reading the file…</p>}
      {problem && <Notice kind="error">{problem}</Notice>}
      {preview && mapping && csv && (
        <>
          <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
            {roles.map(({ key, label }) => (
              <SelectField
                key={key}
                label={label}
                value={mapping[key] ?? ""}
                onChange={(e) => {
                  const next = { ...mapping, [key]: e.target.value };
                  setMapping(next);
                  if (next.text) void check(csv, next);
                }}
                options={[{ value: "", label: key === "text" ? "Pick a column…" : "Not in this file" }, ...preview.headers.map((h) => ({ value: h, label: h }))]}
              />
            ))}
          </div>
          <p className="text-sm text-graphite-700" role="status">
            {preview.total} comment{preview.total === 1 ? "" : "s"} in the file
            {preview.alreadyImported > 0 ? `, ${preview.alreadyImported} imported before` : ""}.{preview.mappingSaved ? " Columns as you mapped them last time." : ""}
          </p>
          {preview.rows.length > 0 && (
            <div className="max-w-full overflow-x-auto">
              <table className="w-full text-left text-sm">
                <caption className="text-left text-xs text-graphite-500">The first {preview.rows.length} rows as they would be imported</caption>
                <thead>
                  <tr className="border-b border-ply-300 text-xs text-graphite-500">
                    <th className="py-1 pr-2">Line</th>
                    <th className="py-1 pr-2">Who</th>
                    <th className="py-1">What they asked</th>
                  </tr>
                </thead>
                <tbody>
                  {preview.rows.map((row) => (
                    <tr key={row.line} className="border-b border-ply-100 align-top">
                      <td className="py-1 pr-2">{row.line}</td>
                      <td className="py-1 pr-2">{row.author ?? "—"}</td>
                      <td className="break-words py-1">{row.text}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          {run.isSuccess && (
            <Notice kind="success">
              Imported: {run.data.added} new suggestion{run.data.added === 1 ? "" : "s"}, {run.data.skipped} already here.
            </Notice>
          )}
          {run.error && <Notice kind="error">{run.error.message}</Notice>}
          <div>
            <Button disabled={!mapping.text || preview.rows.length === 0} busy={run.isPending} onClick={() => run.mutate({ csv, mapping }, { onSuccess: () => void check(csv, mapping) })}>
              Import
            </Button>
          </div>
        </>
      )}
    </section>
  );
}
