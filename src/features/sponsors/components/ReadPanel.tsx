import { useState } from "react";
import { checkDisclosure } from "@shared/sponsors/disclosure";
import { SPEAKING_RATE_SOURCE, analyseRead, mentionsCode, mentionsLink, readTimeWorking } from "@shared/sponsors/read";
import type { DealView } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { changedFields, useOpenedRecord } from "../../../lib/conflicts";
import { formatSeconds } from "../../../lib/format";
import { useUpdateDeal } from "../api/update-deal";
import { useSponsorSettings } from "../api/get-settings";
import { DisclosureGuidance } from "./labels";
import { SelectField, TextAreaField } from "../../../components/form-fields";

/** The read's own fields as the deal holds them. */
const readOf = (deal: DealView) => ({ script: deal.script, descriptionCopy: deal.descriptionCopy ?? "", hostId: deal.host.id ?? "" });

function Check({ ok, label, missing }: { ok: boolean | null; label: string; missing?: string }) {
  if (ok === null) return null;
  return (
    <li className={ok ? "text-moss-600" : "text-alarm-600"}>
      <span aria-hidden>{ok ? "✓" : "✗"}</span> {label}
      {!ok && missing && <span className="text-graphite-500"> — {missing}</span>}
    </li>
  );
}

/**
 * The read: the segment's script against the deal. Counts update as the producer types (the same shared
 * functions the server uses), so the estimate, the ticked points and the disclosure check are never stale.
 */
export function ReadPanel({ channelId, deal, canEdit }: { channelId: string; deal: DealView; canEdit: boolean }) {
  const [script, setScript] = useState(deal.script);
  const [description, setDescription] = useState(deal.descriptionCopy ?? "");
  const [hostId, setHostId] = useState(deal.host.id ?? "");
  // What the editor started from: the deal's read and its version. A save sends only what changed since.
  const record = useOpenedRecord(deal, (from) => {
    setScript(from.script);
    setDescription(from.descriptionCopy ?? "");
    setHostId(from.host.id ?? "");
  });
  const [saved, setSaved] = useState(false);
  const [conflict, setConflict] = useState<{ message: string; myScript: string } | null>(null);
  const settings = useSponsorSettings(channelId);
  const update = useUpdateDeal(channelId, deal.id);
  const hosts = settings.data?.hosts ?? [];
  const wordsPerMinute = hosts.find((h) => h.userId === hostId)?.wordsPerMinute ?? deal.host.wordsPerMinute;

  const read = analyseRead({ script, wordsPerMinute, contractedSeconds: deal.segmentSeconds, talkingPoints: deal.talkingPoints, link: deal.link, promoCode: deal.promoCode });
  const disclosure = checkDisclosure({ script, description, wording: deal.disclosureText });
  // Judged as shown: a difference that rounds to 0:00 is on the mark, not "0:00 long".
  const over = Math.round(read.overBySeconds ?? 0);
  const now = { script, descriptionCopy: description, hostId };
  const dirty = Object.keys(changedFields(readOf(record.opened), now)).length > 0;
  // Someone else's save shows at once while this editor has changed nothing.
  if (deal.version !== record.version && !dirty && !update.isPending) record.startFrom(deal);

  const save = async () => {
    setSaved(false);
    setConflict(null);
    const { hostId: host, ...text } = changedFields(readOf(record.opened), now);
    try {
      record.startFrom(await update.mutateAsync({ ...text, ...(host === undefined ? {} : { hostId: host || null }), version: record.version }));
      setSaved(true);
    } catch (error) {
      const myScript = script;
      const message = record.conflictIn(error);
      if (message) setConflict({ message, myScript });
    }
  };

  return (
    <div className="grid gap-4 lg:grid-cols-[1fr_18rem]">
      <div className="flex flex-col gap-3">
        {canEdit ? (
          <>
            <TextAreaField label="Script of the segment" rows={8} value={script} onChange={(e) => setScript(e.target.value)} />
            <TextAreaField
              label="Description text for this sponsor"
              rows={3}
              value={description}
              onChange={(e) => setDescription(e.target.value)}
              hint="The lines that go in the video's description: the link, the code and the disclosure."
            />
            <div className="flex flex-wrap items-end gap-3">
              <div className="w-64">
                <SelectField
                  label="Read by"
                  value={hostId}
                  onChange={(e) => setHostId(e.target.value)}
                  options={[{ value: "", label: `Default rate (${deal.host.wordsPerMinute} wpm)` }, ...hosts.map((h) => ({ value: h.userId, label: `${h.name} (${h.wordsPerMinute} wpm)` }))]}
                />
              </div>
              <Button onClick={() => void save()} busy={update.isPending} disabled={!dirty}>
                Save the read
              </Button>
              {saved && !dirty && <span className="text-sm text-moss-600">Saved.</span>}
            </div>
            {conflict ? (
              <Notice kind="error">
                <p>{conflict.message}</p>
                <details className="mt-2">
                  <summary className="cursor-pointer">Your script, not saved</summary>
                  <p className="mt-1 whitespace-pre-wrap text-graphite-700">{conflict.myScript}</p>
                  <Button tone="quiet" className="mt-2 px-2 py-1" onClick={() => {
                      setScript(conflict.myScript);
                      setConflict(null);
                    }}
                  >
                    Put my script back
                  </Button>
                </details>
              </Notice>
            ) : (
              update.isError && <Notice kind="error">{update.error.message}</Notice>
            )}
          </>
        ) : (
          <div>
            <p className="mb-1 text-sm font-medium text-graphite-700">Script of the segment</p>
            <p className="whitespace-pre-wrap rounded-md border border-ply-200 bg-ply-50 p-3 text-sm">{deal.script || "No script yet."}</p>
          </div>
        )}
      </div>
      <div className="flex flex-col gap-3 text-sm">
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 rounded-md border border-ply-200 bg-ply-50 p-3">
          <dt className="text-graphite-500">Words</dt>
          <dd className="font-medium" data-testid="read-words">
            {read.words}
          </dd>
          <dt className="text-graphite-500">Read time</dt>
          <dd className="font-medium" data-testid="read-time">
            {formatSeconds(read.estimatedSeconds)} at {wordsPerMinute} wpm
          </dd>
          <dt className="text-graphite-500">Contracted</dt>
          <dd>{formatSeconds(deal.segmentSeconds)}</dd>
          <dt className="text-graphite-500">Difference</dt>
          <dd className={Math.abs(over) <= 5 ? "text-moss-600" : "text-alarm-600"}>
            {over > 0 ? `${formatSeconds(over)} long` : over < 0 ? `${formatSeconds(-over)} short` : "on the mark"}
          </dd>
          {deal.cut.timing && (
            <>
              <dt className="text-graphite-500">Measured in the cut</dt>
              <dd className="font-medium">{formatSeconds(deal.cut.timing.measuredSeconds)}</dd>
            </>
          )}
        </dl>
        <p className="text-xs text-graphite-500" data-testid="read-time-working">
          Read time: {readTimeWorking(read.words, wordsPerMinute)}.
        </p>
        <p className="text-xs text-graphite-500">Speaking rate: {SPEAKING_RATE_SOURCE}; each host sets their own on the Sponsors page.</p>
        <div>
          <p className="font-semibold">
            Talking points ({read.pointsCovered} of {read.points.length})
          </p>
          <ul className="mt-1 flex flex-col gap-1">
            {read.points.map((p) => (
              <Check key={p.point} ok={p.covered !== null} label={p.point} missing={p.missing.length ? `missing: ${p.missing.join(", ")}` : undefined} />
            ))}
            {read.points.length === 0 && <li className="text-graphite-500">No required points.</li>}
          </ul>
        </div>
        <ul className="flex flex-col gap-1">
          <Check ok={read.linkInScript} label="Link said in the script" />
          <Check ok={read.codeInScript} label="Promo code said in the script" />
          <Check ok={deal.link ? mentionsLink(description, deal.link) : null} label="Link in the description" />
          <Check ok={deal.promoCode ? mentionsCode(description, deal.promoCode) : null} label="Promo code in the description" />
          <Check ok={disclosure.inSegment} label="Disclosure in the segment" missing='say it aloud, e.g. "this video is sponsored by …"' />
          <Check ok={disclosure.inDescription} label="Disclosure in the description" />
        </ul>
        <DisclosureGuidance />
      </div>
    </div>
  );
}
