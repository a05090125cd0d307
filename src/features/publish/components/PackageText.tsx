import { useState } from "react";
import { checkChapterText, formatChapters } from "@shared/publish/chapters";
import { buildDescription, type DescriptionParts } from "@shared/publish/description";
import { checkDescription, checkTitle, TITLE_MAX_CHARACTERS } from "@shared/publish/limits";
import { chaptersFromCsv, chaptersFromEdl, chaptersFromMarks, type MarkerImport, type MarkSpan } from "@shared/publish/markers";
import { frameRateNames, frameRates, type FrameRateName } from "@shared/timecode/rates";
import { Button } from "../../../components/Button";
import { SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import type { Draft } from "./draft";

const problemList = (problems: string[]) =>
  problems.length > 0 && (
    <ul className="list-disc pl-5 text-xs text-alarm-600">
      {problems.map((p) => (
        <li key={p}>{p}</li>
      ))}
    </ul>
  );

export function Titles({ draft, change, canWrite }: { draft: Draft; change: (d: Partial<Draft>) => void; canWrite: boolean }) {
  const setTitle = (index: number, text: string) => change({ titles: draft.titles.map((t, i) => (i === index ? text : t)) });
  const remove = (index: number) => {
    const chosen = draft.chosenTitle === null || draft.chosenTitle === index ? null : draft.chosenTitle > index ? draft.chosenTitle - 1 : draft.chosenTitle;
    change({ titles: draft.titles.filter((_, i) => i !== index), chosenTitle: chosen });
  };
  return (
    <fieldset className="min-w-0 space-y-2">
      <legend className="font-semibold text-graphite-900">Titles</legend>
      <p className="text-xs text-graphite-500">Write a few; the one you pick goes out, the others are kept. The platform takes at most {TITLE_MAX_CHARACTERS} characters, without &quot;&lt;&quot; or &quot;&gt;&quot;.</p>
      {draft.titles.length === 0 && <p className="text-sm text-graphite-700">No titles yet.</p>}
      {draft.titles.map((title, index) => {
        const check = checkTitle(title);
        return (
          <div key={index} className="flex flex-wrap items-start gap-2 rounded-md border border-ply-300 p-2">
            <input type="radio" name="chosen-title" className="mt-3 size-4 accent-rust-600" aria-label={`Use title ${index + 1}`} checked={draft.chosenTitle === index} disabled={!canWrite} onChange={() => change({ chosenTitle: index })} />
            <div className="min-w-0 flex-1">
              <TextField label={`Title ${index + 1}`} value={title} disabled={!canWrite} onChange={(e) => setTitle(index, e.target.value)} hint={`${check.used} / ${check.limit} characters`} error={check.problems[0]} />
            </div>
            {canWrite && (
              <Button tone="quiet" type="button" className="mt-6" onClick={() => remove(index)} aria-label={`Remove title ${index + 1}`}>
                Remove
              </Button>
            )}
          </div>
        );
      })}
      {canWrite && (
        <Button tone="quiet" type="button" onClick={() => change({ titles: [...draft.titles, ""], chosenTitle: draft.chosenTitle ?? draft.titles.length })}>
          Add a title
        </Button>
      )}
    </fieldset>
  );
}

export function Description({ draft, change, sources, canWrite }: { draft: Draft; change: (d: Partial<Draft>) => void; sources: DescriptionParts; canWrite: boolean }) {
  const check = checkDescription(draft.description);
  const drafted = () => buildDescription({ ...sources, chapters: checkChapterText(draft.chapters).chapters });
  return (
    <div className="space-y-2">
      <TextAreaField
        label="Description"
        rows={10}
        value={draft.description}
        disabled={!canWrite}
        onChange={(e) => change({ description: e.target.value })}
        hint={`${check.used} / ${check.limit} bytes: the platform counts the description in bytes of UTF-8, so an accented letter takes 2 and most emoji 4.`}
      />
      {problemList(check.problems)}
      {canWrite && (
        <Button tone="quiet" type="button" onClick={() => change({ description: drafted() })}>
          Draft from the episode
        </Button>
      )}
      <p className="text-xs text-graphite-500">
        The draft puts each paid deal&apos;s disclosure in the first lines, then the summary, the deal&apos;s link and code, the chapters, the parts the bench used and the credits. Kerf checks a disclosure is there; the law where the video is seen governs.
      </p>
    </div>
  );
}

type MarkerKind = "edl" | "csv";

export function Chapters({ draft, change, marks, canWrite }: { draft: Draft; change: (d: Partial<Draft>) => void; marks: MarkSpan[]; canWrite: boolean }) {
  const [rate, setRate] = useState<FrameRateName>("25");
  const [start, setStart] = useState("01:00:00:00");
  const [notes, setNotes] = useState<string[]>([]);
  const check = checkChapterText(draft.chapters);
  async function importFile(file: File) {
    const kind: MarkerKind = file.name.toLowerCase().endsWith(".edl") ? "edl" : "csv";
    const options = { format: { rate: frameRates[rate], dropFrame: false }, start };
    const text = await file.text();
    take(kind === "edl" ? chaptersFromEdl(text, options) : chaptersFromCsv(text, options), file.name);
  }
  function take(found: MarkerImport, from: string) {
    setNotes([`${found.chapters.length} chapter${found.chapters.length === 1 ? "" : "s"} read from ${from}.`, ...found.problems]);
    if (found.chapters.length > 0) change({ chapters: formatChapters(found.chapters) });
  }
  return (
    <div className="space-y-2">
      <TextAreaField label="Chapters" rows={6} value={draft.chapters} disabled={!canWrite} onChange={(e) => change({ chapters: e.target.value })} hint='One per line, as the platform reads them: "0:00 Intro".' />
      {check.problems.length === 0 ? <p className="text-xs text-moss-600">The chapters keep the platform&apos;s rules.</p> : problemList(check.problems)}
      {canWrite && (
        <div className="grid gap-2 rounded-md border border-ply-300 p-3 sm:grid-cols-3">
          <SelectField label="Frame rate of the list" value={rate} onChange={(e) => setRate(e.target.value as FrameRateName)} options={frameRateNames.map((n) => ({ value: n, label: `${n} fps` }))} />
          <TextField label="Timeline starts at" value={start} onChange={(e) => setStart(e.target.value)} hint="A CSV list counts from here; an EDL from its first event." />
          <label className="text-sm font-medium text-graphite-700">
            Import markers (.edl or .csv)
            <input type="file" accept=".edl,.csv,text/csv" className="mt-1 block w-full text-sm" onChange={(e) => e.target.files?.[0] && void importFile(e.target.files[0])} />
          </label>
          <div className="sm:col-span-3">
            <Button tone="quiet" type="button" onClick={() => take(chaptersFromMarks(marks), "the footage's marks")}>
              Take from the footage&apos;s marks ({marks.length})
            </Button>
            <p className="text-xs text-graphite-500">Each mark with a note starts a chapter, the marks laid end to end as the footage&apos;s edit decision list lays them.</p>
          </div>
          {notes.length > 0 && (
            <div role="status" className="text-xs text-graphite-700 sm:col-span-3">
              {notes.map((n) => (
                <p key={n}>{n}</p>
              ))}
            </div>
          )}
        </div>
      )}
    </div>
  );
}
