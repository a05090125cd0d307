import { type Role, roleMay } from "@shared/access/roles";
import type { ResultsCardView } from "@shared/bench/results-card-view";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { useResultsCard } from "../api/get-results-card";
import { useRequestResultsCard } from "../api/request-results-card";
import { CardColoursForm } from "./CardColoursForm";
import { Panel } from "./marks";

const stateWords: Record<ResultsCardView["state"], string> = {
  queued: "Waiting for its turn to be drawn…",
  drawing: "Drawing the card…",
  ready: "Ready.",
  failed: "Drawing failed.",
};

/**
 * The results card: the comparison as a 1920 × 1080 picture for the edit, drawn by the server from
 * the same figures as the table, kept with the episode's stills, downloadable as PNG and SVG.
 */
export function ResultsCard({ channelId, episodeId, role }: { channelId: string; episodeId: string; role: Role }) {
  const canWrite = roleMay(role, "bench", "W");
  const card = useResultsCard(channelId, episodeId);
  const request = useRequestResultsCard(channelId, episodeId);
  return (
    <Panel>
      <section aria-labelledby="results-card-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h3 id="results-card-heading" className="font-semibold">
            Results card for the edit
          </h3>
          {canWrite && (
            <Button tone="quiet" busy={request.isPending} onClick={() => request.mutate(undefined)}>
              {card.data ? "Draw the card again" : "Draw the results card"}
            </Button>
          )}
        </div>
        <p className="text-sm text-graphite-700">The candidates and their verdicts as a full-HD picture (1920 × 1080), in big type, with the table's figures and units. It is kept with this episode's stills.</p>
        {request.error && <Notice kind="error">{request.error.message}</Notice>}
        <QueryState query={card} loading="Looking for the card…">
          {(view) => (view ? <CardState view={view} /> : <p className="text-sm text-graphite-500">{canWrite ? "No card yet: draw one when the runs are in." : "No card yet: the crew draws one when the runs are in."}</p>)}
        </QueryState>
        {roleMay(role, "publish", "W") && <CardColoursForm channelId={channelId} />}
      </section>
    </Panel>
  );
}

function CardState({ view }: { view: ResultsCardView }) {
  const busy = view.state === "queued" || view.state === "drawing";
  return (
    <div className="flex flex-col gap-3">
      <p role="status" className="flex items-center gap-2 text-sm font-semibold text-graphite-700">
        {busy && <span className="size-3 rounded-full border-2 border-rust-600 border-t-transparent motion-safe:animate-spin" aria-hidden />}
        {view.state === "failed" ? null : stateWords[view.state]}
      </p>
      {view.state === "failed" && <Notice kind="error">{view.failure ?? stateWords.failed}</Notice>}
      {view.png && (
        <>
          <img src={view.png.url} alt={busy ? "The card as last drawn" : "The results card"} width={1920} height={1080} className="h-auto w-full max-w-xl rounded border border-ply-300" />
          <div className="flex flex-wrap gap-4 text-sm">
            <a href={view.png.url} download={view.png.fileName} className="font-semibold text-rust-600 underline">
              Download the card as PNG
            </a>
            {view.svg && (
              <a href={view.svg.url} download={view.svg.fileName} className="font-semibold text-rust-600 underline">
                Download the card as SVG
              </a>
            )}
          </div>
        </>
      )}
    </div>
  );
}
