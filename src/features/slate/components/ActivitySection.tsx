import { useRef, useState, type ReactNode } from "react";
import type { EpisodeComment } from "@shared/slate/schemas";
import { Button } from "../../../components/Button";
import { TextAreaField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { Empty, QueryState } from "../../../components/States";
import { formatInstant } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useAddComment } from "../api/add-comment";
import { useComments } from "../api/get-comments";
import { usePeople } from "../api/get-people";
import { slateSchemas } from "../schemas-later";
import { useMentionSuggestions } from "./MentionSuggestions";

/** Comments on the episode; "@Name" mentions a member, who gets an e-mail. */
export function ActivitySection({ channelId, episodeId }: { channelId: string; episodeId: string }) {
  const comments = useComments(channelId, episodeId);
  const timeZone = useTimeZone();
  return (
    <div className="rounded-lg border border-ply-300 bg-white p-5">
      <QueryState query={comments} loading="Loading comments…" isEmpty={(list) => list.length === 0} empty={<Empty title="No comments yet">Ask a question or leave a note for the team.</Empty>}>
        {(list) => (
          <ol className="mb-5 space-y-4">
            {list.map((c) => (
              <li key={c.id} className="text-sm">
                <p>
                  <span className="font-semibold">{c.authorName ?? "Someone no longer here"}</span>{" "}
                  <time dateTime={c.createdAt} className="text-xs text-graphite-500">
                    {formatInstant(c.createdAt, timeZone)}
                  </time>
                </p>
                <p className="mt-1 whitespace-pre-line">{withMentions(c)}</p>
              </li>
            ))}
          </ol>
        )}
      </QueryState>
      <CommentForm channelId={channelId} episodeId={episodeId} />
    </div>
  );
}

/** The comment's text with each mention of a member picked out. */
function withMentions(comment: EpisodeComment): ReactNode[] {
  const names = comment.mentions.map((m) => m.name).sort((a, b) => b.length - a.length);
  if (names.length === 0) return [comment.body];
  const escaped = names.map((n) => n.replace(/[.*+?^${}()|[\]\\]/g, "\\$&"));
  const parts = comment.body.split(new RegExp(`(@(?:${escaped.join("|")}))`, "giu"));
  return parts.map((part, i) =>
    i % 2 === 1 ? (
      <mark key={i} className="rounded bg-amber-cut/40 px-0.5 text-graphite-900">
        {part}
      </mark>
    ) : (
      part
    ),
  );
}

function CommentForm({ channelId, episodeId }: { channelId: string; episodeId: string }) {
  const people = usePeople(channelId);
  const add = useAddComment(channelId, episodeId);
  const [body, setBody] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const box = useRef<HTMLTextAreaElement>(null);
  const suggestions = useMentionSuggestions({ box, text: body, setText: setBody, people: people.data ?? [] });

  const mention = (name: string) => {
    const el = box.current;
    const at = el?.selectionStart ?? body.length;
    const before = body.slice(0, at);
    const spacer = before === "" || /\s$/.test(before) ? "" : " ";
    const next = `${before}${spacer}@${name} ${body.slice(at)}`;
    setBody(next);
    requestAnimationFrame(() => {
      el?.focus();
      const caret = before.length + spacer.length + name.length + 2;
      el?.setSelectionRange(caret, caret);
    });
  };

  const submit = async () => {
    setSent(null);
    const { commentSchema } = await slateSchemas();
    const parsed = commentSchema.safeParse({ body });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? "Write a comment first.");
    setError(null);
    try {
      const comment = await add.mutateAsync(parsed.data);
      setBody("");
      const mailed = comment.mentions.filter((m) => m.id !== comment.authorId).map((m) => m.name);
      setSent(mailed.length > 0 ? `Posted. ${mailed.join(", ")} will get an e-mail.` : "Posted.");
    } catch (e) {
      setError((e as Error).message);
    }
  };

  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      noValidate
    >
      <TextAreaField
        label="Add a comment"
        ref={box}
        value={body}
        error={error ?? undefined}
        hint="Type @ and a member's name (arrows and Enter pick a suggestion), or pick one below, to send them an e-mail."
        {...suggestions.boxProps}
      />
      {suggestions.list}
      <div className="mt-2 flex flex-wrap items-center gap-1 text-xs">
        <span className="text-graphite-500">Mention:</span>
        {(people.data ?? []).map((p) => (
          <button key={p.id} type="button" className="rounded-full border border-ply-300 px-2 py-0.5 hover:bg-ply-200" onClick={() => mention(p.name)}>
            @{p.name}
          </button>
        ))}
      </div>
      <div className="mt-3 flex items-center gap-3">
        <Button type="submit" busy={add.isPending}>
          Post comment
        </Button>
        {sent && <Notice kind="success">{sent}</Notice>}
      </div>
    </form>
  );
}
