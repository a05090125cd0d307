import { useState } from "react";
import { type CardColours, colourProblems, contrastRatio } from "@shared/bench/card-colours";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { useCardColours, useSaveCardColours } from "../api/card-colours";

const fields: { key: keyof CardColours; label: string }[] = [
  { key: "background", label: "Background" },
  { key: "ink", label: "Text" },
  { key: "accent", label: "Best candidate's mark" },
];

/** The channel's card colours, with the text's contrast said before saving. */
export function CardColoursForm({ channelId }: { channelId: string }) {
  const current = useCardColours(channelId);
  if (!current.data) return null;
  return <ColoursForm key={JSON.stringify(current.data.colours)} channelId={channelId} saved={current.data.colours} own={current.data.own} />;
}

function ColoursForm({ channelId, saved, own }: { channelId: string; saved: CardColours; own: boolean }) {
  const [colours, setColours] = useState(saved);
  const save = useSaveCardColours(channelId);
  const problem = colourProblems(colours)[0];
  return (
    <details className="rounded-md border border-ply-200 p-3 text-sm">
      <summary className="cursor-pointer font-semibold">The channel's card colours{own ? " (Kerf's own)" : ""}</summary>
      <form
        aria-label="Card colours"
        className="mt-3 flex flex-col gap-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (!problem) save.mutate(colours);
        }}
      >
        <div className="flex flex-wrap gap-4">
          {fields.map((field) => (
            <label key={field.key} className="flex items-center gap-2">
              <input type="color" value={colours[field.key]} onChange={(event) => setColours({ ...colours, [field.key]: event.target.value })} className="h-9 w-12 rounded border border-ply-300" />
              {field.label}
            </label>
          ))}
        </div>
        <p className="text-graphite-700">Text against background: {contrastRatio(colours.ink, colours.background).toFixed(1)} : 1 (at least 4.5 : 1 reads at a glance).</p>
        {problem && <Notice kind="error">{problem}</Notice>}
        {save.error && <Notice kind="error">{save.error.message}</Notice>}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" tone="quiet" busy={save.isPending} disabled={Boolean(problem)}>
            Save the colours
          </Button>
          {!own && (
            <Button type="button" tone="quiet" onClick={() => save.mutate(null)}>
              Back to Kerf's own
            </Button>
          )}
        </div>
        <p className="text-xs text-graphite-500">They apply to the next card drawn.</p>
      </form>
    </details>
  );
}
