import { useState } from "react";
import { Link } from "react-router-dom";
import { ideaStatusLabels, type IdeaView, type Judgement } from "@shared/intake/schemas";
import { dimensionLabels, dimensions } from "@shared/intake/weighing";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField, TextField } from "../../../components/form-fields";
import { formatInstantDay } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useDeclineIdea, useJudgeIdea, useMergeIdeas, usePromoteIdea, useSetIdeaAside } from "../api/idea-actions";
import { TheirWords } from "./TheirWords";

const scaleOptions = [
  { value: "", label: "Not judged" },
  { value: "1", label: "1 – low" },
  { value: "2", label: "2 – middling" },
  { value: "3", label: "3 – high" },
];

export function IdeaCard({ channelId, idea, others, mayPromote }: { channelId: string; idea: IdeaView; others: IdeaView[]; mayPromote: boolean }) {
  const zone = useTimeZone();
  const open = idea.status === "open";
  const headingId = `idea-${idea.id}`;
  return (
    <article aria-labelledby={headingId} className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="min-w-0 break-words font-semibold">
          {idea.wording}
        </h3>
        <span className="text-xs uppercase tracking-wide text-graphite-500">{ideaStatusLabels[idea.status]}</span>
      </div>
      <p className="text-sm text-graphite-700">
        {idea.people === 1 ? "1 person" : `${idea.people} people`} asked ({idea.suggestions} suggestion{idea.suggestions === 1 ? "" : "s"}), first {formatInstantDay(idea.firstAsked, zone)}, last {formatInstantDay(idea.lastAsked, zone)}.
      </p>
      <ul className="flex flex-col gap-1 border-l-2 border-ply-300 pl-3 text-sm italic text-graphite-700">
        {idea.samples.map((sample, i) => (
          <li key={i} className="break-words">
            “{sample}”
          </li>
        ))}
      </ul>
      {idea.declineReason && <p className="text-sm text-graphite-700">Turned down: {idea.declineReason}</p>}
      <Combined idea={idea} />
      {open && <Weigh channelId={channelId} idea={idea} />}
      <TheirWords channelId={channelId} idea={idea} />
      {idea.status !== "promoted" && <Decisions channelId={channelId} idea={idea} others={others} mayPromote={mayPromote} />}
      {idea.episodeId && (
        <Link className="text-sm font-semibold text-rust-600 underline" to={`/c/${channelId}/episodes/${idea.episodeId}`}>
          Open its episode
        </Link>
      )}
    </article>
  );
}

function Combined({ idea }: { idea: IdeaView }) {
  if (idea.judges === 0) return <p className="text-sm text-graphite-500">Nobody has weighed this idea yet.</p>;
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-5" aria-label={`The channel's view, from ${idea.judges} member${idea.judges === 1 ? "" : "s"}`}>
      {dimensions.map((d) => (
        <div key={d}>
          <dt className="text-xs text-graphite-500">{dimensionLabels[d].name}</dt>
          <dd className="font-semibold">{idea.combined[d]?.toFixed(1)}</dd>
        </div>
      ))}
      <div>
        <dt className="text-xs text-graphite-500">Combined</dt>
        <dd className="font-semibold">{idea.combinedScore?.toFixed(1)} of 3</dd>
      </div>
    </dl>
  );
}

function Weigh({ channelId, idea }: { channelId: string; idea: IdeaView }) {
  const judge = useJudgeIdea(channelId);
  const [scores, setScores] = useState<Record<string, string>>(() => Object.fromEntries(dimensions.map((d) => [d, idea.mine ? String(idea.mine[d]) : ""])));
  const complete = dimensions.every((d) => scores[d]);
  return (
    <details className="rounded-md bg-ply-50 p-3">
      <summary className="cursor-pointer text-sm font-semibold">{idea.mine ? "Change my judgement" : "Weigh it"}</summary>
      <form
        className="mt-2 grid grid-cols-2 gap-3 sm:grid-cols-4"
        onSubmit={(e) => {
          e.preventDefault();
          judge.mutate({ ideaId: idea.id, judgement: Object.fromEntries(dimensions.map((d) => [d, Number(scores[d])])) as Judgement });
        }}
      >
        {dimensions.map((d) => (
          <SelectField key={d} label={dimensionLabels[d].name} hint={`1 ${dimensionLabels[d].low}, 3 ${dimensionLabels[d].high}`} value={scores[d]} onChange={(e) => setScores({ ...scores, [d]: e.target.value })} options={scaleOptions} />
        ))}
        <div className="col-span-full flex flex-wrap items-center gap-3">
          <Button type="submit" tone="quiet" busy={judge.isPending} disabled={!complete}>
            Save my judgement
          </Button>
          {!complete && <span className="text-xs text-graphite-500">Pick all four to save.</span>}
          {judge.isSuccess && <span className="text-sm text-graphite-700">Saved.</span>}
        </div>
        {judge.error && <Notice kind="error">{judge.error.message}</Notice>}
      </form>
    </details>
  );
}

function Decisions({ channelId, idea, others, mayPromote }: { channelId: string; idea: IdeaView; others: IdeaView[]; mayPromote: boolean }) {
  const merge = useMergeIdeas(channelId);
  const aside = useSetIdeaAside(channelId);
  const decline = useDeclineIdea(channelId);
  const promote = usePromoteIdea(channelId);
  const [other, setOther] = useState("");
  const [reason, setReason] = useState("");
  const failed = merge.error ?? aside.error ?? decline.error ?? promote.error;
  return (
    <div className="flex flex-col gap-3">
      {idea.status === "open" && others.length > 0 && (
        <div className="flex flex-wrap items-end gap-2">
          <SelectField label="Same ask as" value={other} onChange={(e) => setOther(e.target.value)} options={[{ value: "", label: "Pick another idea…" }, ...others.map((o) => ({ value: o.id, label: o.wording.slice(0, 80) }))]} />
          <Button tone="quiet" disabled={!other} busy={merge.isPending} onClick={() => merge.mutate({ ideaId: idea.id, otherIdeaId: other }, { onSuccess: () => setOther("") })}>
            Fold it into this idea
          </Button>
        </div>
      )}
      <div className="flex flex-wrap items-end gap-2">
        {mayPromote && idea.status === "open" && (
          <Button busy={promote.isPending} onClick={() => promote.mutate(idea.id)}>
            Put it on the slate
          </Button>
        )}
        <Button tone="quiet" busy={aside.isPending} onClick={() => aside.mutate({ ideaId: idea.id, aside: idea.status === "open" })}>
          {idea.status === "open" ? "Set it aside" : "Back to open"}
        </Button>
      </div>
      {idea.status !== "declined" && (
        <div className="flex flex-wrap items-end gap-2">
          <TextField label="Reason to turn it down" value={reason} onChange={(e) => setReason(e.target.value)} error={decline.error instanceof Error && "fields" in decline.error ? (decline.error.fields as Record<string, string>).reason : undefined} />
          <Button tone="danger" disabled={!reason.trim()} busy={decline.isPending} onClick={() => decline.mutate({ ideaId: idea.id, reason })}>
            Turn it down
          </Button>
        </div>
      )}
      {failed && <Notice kind="error">{failed.message}</Notice>}
    </div>
  );
}
