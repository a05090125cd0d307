import { useState } from "react";
import { originLabels } from "@shared/slate/choices";
import type { EpisodeDetail, EpisodeFields, EpisodeRecord } from "@shared/slate/schemas";
import { stageIndex, stageLabels, stages, type Stage } from "@shared/slate/stages";
import type { GateProblem } from "@shared/slate/gates";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { ApiError } from "../../../lib/api-client";
import { useArchiveEpisode } from "../api/archive-episode";
import { useEditEpisode } from "../api/edit-episode";
import { isConflict } from "../api/episode-mutation";
import { gateProblemsOf, useMoveEpisode } from "../api/move-episode";
import { Dialog } from "./Dialog";
import { EpisodeForm } from "./EpisodeFormLoader";
import { formatDay, formatMoney } from "../../../lib/format";
import { GateDialog } from "./GateDialog";

const conflictNotice = "Someone else changed this episode a moment ago; the page now shows their version. Make your change again if it still applies.";

const fieldsOf = (e: EpisodeRecord): EpisodeFields => ({
  title: e.title,
  question: e.question,
  origin: e.origin,
  originLink: e.originLink ?? "",
  whyWorthIt: e.whyWorthIt,
  ownerId: e.ownerId ?? "",
  tags: e.tags,
  budgetAmount: e.budgetAmount ?? "",
  budgetCurrency: e.budgetCurrency ?? "",
  targetPublishDate: e.targetPublishDate ?? "",
});

/** The episode's fields, its stage (with a move control for those who may) and archive/restore. */
export function OverviewSection({ channelId, detail, canEdit }: { channelId: string; detail: EpisodeDetail; canEdit: boolean }) {
  const e = detail.episode;
  const [editing, setEditing] = useState(false);
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);
  const edit = useEditEpisode(channelId, e.id);
  const archive = useArchiveEpisode(channelId, e.id);

  const act = async (work: () => Promise<unknown>, done: string) => {
    setNotice(null);
    try {
      await work();
      setNotice({ kind: "success", text: done });
    } catch (error) {
      setNotice({ kind: "error", text: isConflict(error) ? conflictNotice : (error as Error).message });
    }
  };

  return (
    <div className="rounded-lg border border-ply-300 bg-white p-5">
      {notice && (
        <div className="mb-4">
          <Notice kind={notice.kind}>{notice.text}</Notice>
        </div>
      )}
      {canEdit && !e.archivedAt && <StageMover channelId={channelId} episode={e} onNotice={setNotice} />}
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[12rem_1fr]">
        <dt className="text-graphite-500">Stage</dt>
        <dd className="font-medium">{stageLabels[e.stage]}</dd>
        <dt className="text-graphite-500">Owner</dt>
        <dd>{e.ownerName ?? "No owner yet"}</dd>
        <dt className="text-graphite-500">Target publish date</dt>
        <dd>{e.targetPublishDate ? formatDay(e.targetPublishDate) : "Not set"}</dd>
        <dt className="text-graphite-500">Where it came from</dt>
        <dd>
          {originLabels[e.origin]}
          {e.originLink && (
            <>
              {" · "}
              <a href={e.originLink} target="_blank" rel="noreferrer noopener" className="break-all text-rust-600 underline">
                {e.originLink}
              </a>
            </>
          )}
        </dd>
        <dt className="text-graphite-500">Why it is worth a video</dt>
        <dd className="whitespace-pre-line">{e.whyWorthIt || "—"}</dd>
        <dt className="text-graphite-500">Rough budget</dt>
        <dd>{e.budgetAmount ? (e.budgetCurrency ? formatMoney(e.budgetAmount, e.budgetCurrency) : e.budgetAmount) : "—"}</dd>
        <dt className="text-graphite-500">Tags</dt>
        <dd>{e.tags.length > 0 ? e.tags.join(", ") : "—"}</dd>
        {e.archivedAt && (
          <>
            <dt className="text-graphite-500">Archived</dt>
            <dd>Yes: it is off the board until restored.</dd>
          </>
        )}
      </dl>
      {canEdit && (
        <div className="mt-5 flex flex-wrap gap-2">
          <Button tone="quiet" onClick={() => setEditing(true)}>
            Edit details
          </Button>
          {e.archivedAt ? (
            <Button tone="quiet" busy={archive.isPending} onClick={() => void act(() => archive.mutateAsync({ version: e.version, archived: false }), "Restored: it is back on the board.")}>
              Restore
            </Button>
          ) : (
            <Button tone="danger" busy={archive.isPending} onClick={() => void act(() => archive.mutateAsync({ version: e.version, archived: true }), "Archived: it is off the board. Restore it from here any time.")}>
              Archive
            </Button>
          )}
        </div>
      )}
      <Dialog open={editing} title={`Edit “${e.title}”`} onClose={() => setEditing(false)} wide>
        <EpisodeForm
          channelId={channelId}
          initial={fieldsOf(e)}
          submitLabel="Save changes"
          onCancel={() => setEditing(false)}
          onSubmit={async (fields) => {
            await edit.mutateAsync({ ...fields, version: e.version });
            setEditing(false);
            setNotice({ kind: "success", text: "Saved." });
          }}
        />
      </Dialog>
    </div>
  );
}

/** Moving by a menu: the same move as a drag on the board, for anyone who prefers it. */
function StageMover({ channelId, episode, onNotice }: { channelId: string; episode: EpisodeRecord; onNotice: (n: { kind: "error" | "success"; text: string } | null) => void }) {
  const move = useMoveEpisode(channelId);
  const [target, setTarget] = useState<Stage>(stages[Math.min(stageIndex(episode.stage) + 1, stages.length - 1)]!);
  const [gate, setGate] = useState<GateProblem[] | null>(null);
  const send = (reason?: string) => {
    onNotice(null);
    move.mutate(
      { episodeId: episode.id, version: episode.version, stage: target, reason },
      {
        onSuccess: (moved) => onNotice({ kind: "success", text: `Moved to ${stageLabels[moved.stage]}.` }),
        onError: (error) => {
          const problems = gateProblemsOf(error);
          if (problems) return setGate(problems);
          onNotice({ kind: "error", text: error instanceof ApiError && error.status === 409 ? conflictNotice : error.message });
        },
      },
    );
  };
  return (
    <div className="mb-4 flex flex-wrap items-end gap-2 border-b border-ply-200 pb-4">
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium text-graphite-700">Move to stage</span>
        <select className="rounded-md border border-ply-300 bg-white px-3 py-2" value={target} onChange={(ev) => setTarget(ev.target.value as Stage)}>
          {stages.map((s) => (
            <option key={s} value={s} disabled={s === episode.stage}>
              {stageLabels[s]}
              {s === episode.stage ? " (now)" : ""}
            </option>
          ))}
        </select>
      </label>
      <Button tone="quiet" busy={move.isPending} disabled={target === episode.stage} onClick={() => send()}>
        Move
      </Button>
      {gate && (
        <GateDialog
          title={episode.title}
          to={target}
          problems={gate}
          onCancel={() => setGate(null)}
          onConfirm={(reason) => {
            setGate(null);
            send(reason);
          }}
        />
      )}
    </div>
  );
}
