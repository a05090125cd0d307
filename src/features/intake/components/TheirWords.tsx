import { useState } from "react";
import type { IdeaView } from "@shared/intake/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { formatInstantDay } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useIdea } from "../api/get-idea";
import { useSplitSuggestion } from "../api/idea-actions";

const sourceWords = { page: "public page", import: "imported comment", hand: "typed in" } as const;

/** Every suggestion of an idea, each with a way out when grouping joined it wrongly. */
export function TheirWords({ channelId, idea }: { channelId: string; idea: IdeaView }) {
  const [shown, setShown] = useState(false);
  const detail = useIdea(channelId, idea.id, shown);
  const split = useSplitSuggestion(channelId);
  const zone = useTimeZone();
  return (
    <div>
      <Button tone="quiet" aria-expanded={shown} onClick={() => setShown(!shown)}>
        {shown ? "Hide their words" : `Show all ${idea.suggestions} suggestion${idea.suggestions === 1 ? "" : "s"}`}
      </Button>
      {shown && (
        <QueryState query={detail} loading="Loading the suggestions…">
          {(data) => (
            <ul className="mt-2 flex flex-col gap-2">
              {data.suggestions.map((s) => (
                <li key={s.id} className="flex flex-wrap items-start justify-between gap-2 rounded-md bg-ply-50 p-2 text-sm">
                  <div className="min-w-0 flex-1">
                    <p className="break-words">{s.text}</p>
                    <p className="text-xs text-graphite-500">
                      {s.author ?? "Someone"}, {formatInstantDay(s.askedAt, zone)}, {sourceWords[s.source]}
                      {s.wantsNews ? ", wants to hear when it's out" : ""}
                      {s.link && (
                        <>
                          {" · "}
                          <a className="text-rust-600 underline" href={s.link} rel="noreferrer noopener" target="_blank">
                            where it was asked
                          </a>
                        </>
                      )}
                    </p>
                  </div>
                  {idea.status === "open" && data.suggestions.length > 1 && (
                    <Button tone="quiet" busy={split.isPending && split.variables === s.id} onClick={() => split.mutate(s.id)}>
                      Split it off
                    </Button>
                  )}
                </li>
              ))}
            </ul>
          )}
        </QueryState>
      )}
      {split.error && <Notice kind="error">{split.error.message}</Notice>}
    </div>
  );
}
