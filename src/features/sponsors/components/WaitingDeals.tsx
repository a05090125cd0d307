import { useState } from "react";
import { dealStateLabels, placementLabels, type SponsorDealRow, type SponsorDetail } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField } from "../../../components/form-fields";
import { formatDay, formatMoney } from "../../../lib/format";
import { useTieDeal } from "../api/tie-deal";
import { NewDealForm } from "./NewDealForm";

/**
 * The sponsor's signed deals that wait for their episode, each with a way to tie it, and a way to
 * record another: a deal is often signed before the episode that carries it is on the slate.
 */
export function WaitingDeals({ channelId, sponsor, canEdit }: { channelId: string; sponsor: SponsorDetail; canEdit: boolean }) {
  const [recording, setRecording] = useState(false);
  const waiting = sponsor.deals.filter((d) => d.episodeId === null);
  if (!canEdit && waiting.length === 0) return null;
  return (
    <section aria-labelledby="waiting-deals" className="flex flex-col gap-3">
      <h3 id="waiting-deals" className="font-semibold">
        Waiting for an episode
      </h3>
      {waiting.length === 0 ? (
        <p className="text-sm text-graphite-500">None. A deal signed before its episode is on the slate can be recorded here and tied to the episode later.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {waiting.map((deal) => (
            <WaitingDeal key={deal.id} channelId={channelId} deal={deal} episodes={sponsor.episodes} canEdit={canEdit} />
          ))}
        </ul>
      )}
      {canEdit &&
        (recording ? (
          <NewDealForm channelId={channelId} episodeId={null} sponsorId={sponsor.id} onDone={() => setRecording(false)} />
        ) : (
          <div>
            <Button tone="quiet" onClick={() => setRecording(true)}>
              Record a signed deal
            </Button>
          </div>
        ))}
    </section>
  );
}

function WaitingDeal({ channelId, deal, episodes, canEdit }: { channelId: string; deal: SponsorDealRow; episodes: SponsorDetail["episodes"]; canEdit: boolean }) {
  const tie = useTieDeal(channelId, deal.id);
  const [episodeId, setEpisodeId] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const onTie = async () => {
    setProblem(null);
    if (!episodeId) return setProblem("Pick the episode this deal is for.");
    try {
      await tie.mutateAsync({ episodeId, version: deal.version });
    } catch (error) {
      setProblem(error instanceof Error ? error.message : "The deal could not be tied.");
    }
  };
  const label = `${dealStateLabels[deal.state]} · ${placementLabels[deal.placement]} read${deal.money ? ` · ${formatMoney(deal.money.fee, deal.money.currency)}` : ""}`;
  return (
    <li aria-label={`Deal waiting for an episode: ${label}`} className="flex flex-col gap-2 rounded-md border border-ply-300 bg-ply-50 p-3 text-sm">
      <p>
        <span className="font-medium">{label}</span> · its items are waiting for a publish date
      </p>
      {problem && <Notice kind="error">{problem}</Notice>}
      {canEdit &&
        (episodes.length === 0 ? (
          <p className="text-graphite-500">No episode to tie it to yet: add the episode on the slate first.</p>
        ) : (
          <div className="flex flex-wrap items-end gap-2">
            <div className="min-w-0 flex-1">
              <SelectField
                label="Episode"
                value={episodeId}
                onChange={(e) => setEpisodeId(e.target.value)}
                options={[{ value: "", label: "Pick the episode…" }, ...episodes.map((e) => ({ value: e.id, label: e.publishDate ? `${e.title} (publishes ${formatDay(e.publishDate)})` : `${e.title} (no publish date yet)` }))]}
              />
            </div>
            <Button busy={tie.isPending} onClick={() => void onTie()}>
              Tie to episode
            </Button>
          </div>
        ))}
    </li>
  );
}
