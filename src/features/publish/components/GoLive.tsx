import { useState } from "react";
import type { PublishPackageView } from "@shared/publish/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { TextField } from "../../../components/form-fields";
import { formatInstant } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useGoLive } from "../api/go-live";

/** The gate's findings, and marking the video published (its time and link kept). */
export function GoLive({ pkg, channelId, episodeId, canWrite }: { pkg: PublishPackageView; channelId: string; episodeId: string; canWrite: boolean }) {
  const zone = useTimeZone();
  const goLive = useGoLive(channelId, episodeId);
  const [videoUrl, setVideoUrl] = useState(pkg.videoUrl ?? "");
  const [reason, setReason] = useState("");
  const missing = pkg.gate.length > 0;
  return (
    <section aria-labelledby="go-live-heading" className="space-y-3 rounded-md border border-ply-300 p-4">
      <h3 id="go-live-heading" className="font-semibold text-graphite-900">
        Before it goes live
      </h3>
      {missing ? (
        <ul aria-label="Missing before go-live" className="list-disc space-y-1 pl-5 text-sm text-alarm-600">
          {pkg.gate.map((p) => (
            <li key={`${p.code}-${p.message}`}>{p.message}</li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-moss-600">The package has everything the video needs.</p>
      )}
      {pkg.publishedAt && (
        <Notice kind="success">
          Published {formatInstant(pkg.publishedAt, zone)}
          {pkg.videoUrl && (
            <>
              {" "}
              at <a className="underline" href={pkg.videoUrl}>{pkg.videoUrl}</a>
            </>
          )}
          {pkg.goLiveReason && <> (gone live without everything: {pkg.goLiveReason})</>}
        </Notice>
      )}
      {canWrite && (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            goLive.mutate({ videoUrl, ...(missing && reason ? { reason } : {}) });
          }}
        >
          <TextField label="Link to the published video" type="url" required value={videoUrl} onChange={(e) => setVideoUrl(e.target.value)} />
          {missing && <TextField label="Why it goes live anyway" value={reason} onChange={(e) => setReason(e.target.value)} hint="Needed while something above is missing; it is recorded." />}
          {goLive.error && <Notice kind="error">{goLive.error.message}</Notice>}
          <Button type="submit" busy={goLive.isPending}>
            {pkg.publishedAt ? "Record it again" : "Mark published"}
          </Button>
        </form>
      )}
    </section>
  );
}
