import { useState } from "react";
import { roleMay } from "@shared/access/roles";
import { knownTimeZones } from "@shared/auth/account";
import type { PublishPackageView } from "@shared/publish/schemas";
import { instantOfWallTime } from "@shared/publish/publish-time";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField, TextField } from "../../../components/form-fields";
import { QueryState } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { formatInstant } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { usePackage } from "../api/get-package";
import { useSavePackage } from "../api/save-package";
import { draftOf, inputOf, type Draft } from "./draft";
import { Figures } from "./Figures";
import { GoLive } from "./GoLive";
import { Chapters, Description, Titles } from "./PackageText";
import { Thumbnails } from "./Thumbnails";

/** The publish package: what the video goes out with, checked against the platform's rules, then go-live. */
export function PublishSection({ channelId, episodeId, role }: EpisodeSectionProps) {
  const query = usePackage(channelId, episodeId);
  return (
    <QueryState query={query} loading="Loading the publish package…">
      {(pkg) => <PackageForm key={pkg.version} pkg={pkg} channelId={channelId} episodeId={episodeId} canWrite={roleMay(role, "publish", "W")} />}
    </QueryState>
  );
}

function PublishTime({ draft, change, canWrite }: { draft: Draft; change: (d: Partial<Draft>) => void; canWrite: boolean }) {
  const memberZone = useTimeZone();
  const instant = draft.wallTime ? instantOfWallTime(draft.wallTime, draft.timeZone) : null;
  return (
    <fieldset className="grid min-w-0 gap-2 sm:grid-cols-2">
      <legend className="font-semibold text-graphite-900">Publish time</legend>
      <TextField label="Date and time" type="datetime-local" value={draft.wallTime} disabled={!canWrite} onChange={(e) => change({ wallTime: e.target.value })} />
      <SelectField label="Time zone" value={draft.timeZone} disabled={!canWrite} onChange={(e) => change({ timeZone: e.target.value })} options={knownTimeZones().map((z) => ({ value: z, label: z }))} hint="The channel's zone unless you change it." />
      {instant && <p className="text-sm text-graphite-700 sm:col-span-2">In your zone: {formatInstant(instant, memberZone)}</p>}
    </fieldset>
  );
}

function PackageForm({ pkg, channelId, episodeId, canWrite }: { pkg: PublishPackageView; channelId: string; episodeId: string; canWrite: boolean }) {
  const [draft, setDraft] = useState<Draft>(() => draftOf(pkg));
  const [dirty, setDirty] = useState(false);
  const save = useSavePackage(channelId, episodeId);
  const change = (next: Partial<Draft>) => {
    setDraft((d) => ({ ...d, ...next }));
    setDirty(true);
  };
  const fieldErrors = save.error && "fields" in save.error ? Object.values((save.error as { fields: Record<string, string> }).fields) : [];
  return (
    <div className="space-y-6">
      <form
        className="space-y-6"
        onSubmit={(e) => {
          e.preventDefault();
          save.mutate(inputOf(draft, pkg.version));
        }}
      >
        <Titles draft={draft} change={change} canWrite={canWrite} />
        <Chapters draft={draft} change={change} marks={pkg.marks} canWrite={canWrite} />
        <Description draft={draft} change={change} sources={pkg.sources} canWrite={canWrite} />
        <Thumbnails channelId={channelId} episodeId={episodeId} thumbnails={pkg.thumbnails} chosen={draft.thumbnailId} choose={(id) => change({ thumbnailId: id })} canWrite={canWrite} />
        <PublishTime draft={draft} change={change} canWrite={canWrite} />
        {save.error && (
          <Notice kind="error">
            {save.error.message} {fieldErrors.join(" ")}
          </Notice>
        )}
        {canWrite && (
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" busy={save.isPending}>
              Save the package
            </Button>
            {dirty && <span className="text-sm text-graphite-500">Unsaved changes</span>}
          </div>
        )}
      </form>
      <GoLive pkg={pkg} channelId={channelId} episodeId={episodeId} canWrite={canWrite && !dirty} />
      <Figures channelId={channelId} episodeId={episodeId} title={pkg.chosenTitle === null ? null : (pkg.titles[pkg.chosenTitle] ?? null)} canWrite={canWrite} />
    </div>
  );
}
