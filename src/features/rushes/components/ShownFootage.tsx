import { useState, type FormEvent } from "react";
import { Link } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import type { FootageLinks, ShowingFootage } from "@shared/rushes/schemas";
import { Button } from "../../../components/Button";
import { SelectField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import type { FootageShownProps, ShownThing } from "../../../lib/footage-shown";
import { useFootageLinks } from "../api/footage-links";
import { useLinkClip, type ClipLinks } from "../api/link-clip";
import { useUpdateMark } from "../api/update-mark";

const nameOf = (shows: ShownThing) => `${shows.kind === "run" ? "run" : "iteration"} ${shows.number}`;
const linkField = (shows: ShownThing) => (shows.kind === "run" ? "benchRunId" : "buildIterationId");

/** On a run's or an iteration's card: the clips and marks that show it, each with its poster, and a way to link one more. */
export function ShownFootage({ channelId, episodeId, role, shows }: FootageShownProps) {
  const links = useFootageLinks(channelId, episodeId);
  if (!roleMay(role, "footage", "R")) return null;
  return (
    <section aria-label={`Footage of ${nameOf(shows)}`} className="mt-3 border-t border-ply-200 pt-3">
      <p className="mb-2 text-xs font-semibold uppercase tracking-wide text-graphite-500">Footage of {nameOf(shows)}</p>
      <QueryState query={links} loading="Loading footage…">
        {(data) => <ShownList channelId={channelId} data={data} shows={shows} canLink={roleMay(role, "footage", "W")} />}
      </QueryState>
    </section>
  );
}

function ShownList({ channelId, data, shows, canLink }: { channelId: string; data: FootageLinks; shows: ShownThing; canLink: boolean }) {
  const target = (shows.kind === "run" ? data.runs : data.iterations).find((t) => t.id === shows.id);
  const footage = target?.footage ?? [];
  return (
    <div className="flex flex-col gap-3">
      {footage.length === 0 ? (
        <p className="text-sm text-graphite-500">No clip or mark shows {nameOf(shows)} yet.</p>
      ) : (
        <ul className="grid grid-cols-1 gap-2 sm:grid-cols-2" aria-label={`Clips and marks showing ${nameOf(shows)}`}>
          {footage.map((item) => (
            <ShownItem key={item.mark ? `mark-${item.mark.id}` : `clip-${item.clipId}`} channelId={channelId} item={item} shows={shows} canLink={canLink} />
          ))}
        </ul>
      )}
      {canLink && <LinkClipForm channelId={channelId} data={data} shows={shows} />}
    </div>
  );
}

function ShownItem({ channelId, item, shows, canLink }: { channelId: string; item: ShowingFootage; shows: ShownThing; canLink: boolean }) {
  const unlinkClip = useLinkClip(channelId);
  const unlinkMark = useUpdateMark(channelId, item.clipId);
  const unlink = item.mark ? unlinkMark : unlinkClip;
  const field = linkField(shows);
  const what = item.mark ? `the mark ${item.mark.in} to ${item.mark.out} of ${item.fileName}` : item.fileName;
  const label = item.mark ? `${item.fileName}, mark ${item.mark.in} to ${item.mark.out}` : item.fileName;
  const remove = () => {
    const links: ClipLinks = { [field]: null };
    if (item.mark) unlinkMark.mutate({ markId: item.mark.id, patch: links });
    else unlinkClip.mutate({ clipId: item.clipId, links });
  };
  return (
    <li aria-label={label} className="flex min-w-0 gap-3 rounded-md border border-ply-200 bg-ply-50 p-2">
      {item.posterUrl ? (
        <img src={item.posterUrl} alt={`Poster of ${item.fileName}`} className="aspect-video w-24 shrink-0 rounded bg-graphite-900 object-cover" loading="lazy" />
      ) : (
        <span className="flex aspect-video w-24 shrink-0 items-center justify-center rounded bg-graphite-900 text-center text-[10px] text-ply-200">No poster</span>
      )}
      <div className="flex min-w-0 flex-1 flex-col gap-1 text-sm">
        <Link to={`/c/${channelId}/rushes?clip=${item.clipId}`} className="font-medium break-all text-rust-600 underline">
          {item.fileName}
        </Link>
        {item.mark ? (
          <span className="text-graphite-700">
            <span className="font-mono text-xs">
              {item.mark.in} → {item.mark.out}
            </span>
            {item.mark.note && <span className="block break-words">{item.mark.note}</span>}
          </span>
        ) : (
          <span className="text-xs text-graphite-500">Whole clip</span>
        )}
        {canLink && (
          <div>
            <Button tone="quiet" className="px-2 py-0.5 text-xs" busy={unlink.isPending} aria-label={`Unlink ${what} from ${nameOf(shows)}`} onClick={remove}>
              Unlink
            </Button>
          </div>
        )}
        {unlink.error && <p className="text-xs text-alarm-600">{unlink.error.message}</p>}
      </div>
    </li>
  );
}

/** A select of the episode's clips: choosing one links the whole clip (moving it from any other run or iteration). */
function LinkClipForm({ channelId, data, shows }: { channelId: string; data: FootageLinks; shows: ShownThing }) {
  const link = useLinkClip(channelId);
  const [clipId, setClipId] = useState("");
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);
  const field = linkField(shows);
  const numbers = new Map((shows.kind === "run" ? data.runs : data.iterations).map((t) => [t.id, t.number]));
  const choices = data.clips.filter((c) => c[field] !== shows.id);
  if (data.clips.length === 0) return <p className="text-xs text-graphite-500">This episode has no footage yet; upload clips in its Footage part.</p>;
  if (choices.length === 0) return null;
  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setNotice(null);
    if (!clipId) return setNotice({ kind: "error", text: "Choose a clip first." });
    try {
      const clip = await link.mutateAsync({ clipId, links: { [field]: shows.id } });
      setClipId("");
      setNotice({ kind: "success", text: `${clip.fileName} linked.` });
    } catch (error) {
      setNotice({ kind: "error", text: (error as Error).message });
    }
  };
  const options = [
    { value: "", label: "Choose a clip…" },
    ...choices.map((c) => {
      const now = c[field] ? numbers.get(c[field]) : undefined;
      return { value: c.id, label: now === undefined ? c.fileName : `${c.fileName} (now ${shows.kind} ${now})` };
    }),
  ];
  return (
    <form onSubmit={(e) => void submit(e)} className="flex flex-wrap items-end gap-2" aria-label={`Link a clip to ${nameOf(shows)}`}>
      <div className="min-w-0 flex-1 basis-48">
        <SelectField label="Link a clip" value={clipId} onChange={(e) => setClipId(e.target.value)} options={options} />
      </div>
      <Button type="submit" tone="quiet" busy={link.isPending}>
        Link
      </Button>
      {data.moreClips && <p className="w-full text-xs text-graphite-500">The newest 500 clips are listed; link older ones from the clip's own panel.</p>}
      {notice && (
        <div className="w-full">
          <Notice kind={notice.kind}>{notice.text}</Notice>
        </div>
      )}
    </form>
  );
}
