import { useState, type FormEvent } from "react";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { TextAreaField, TextField } from "../../../components/form-fields";
import { ApiError } from "../../../lib/api-client";
import { useAddByHand } from "../api/idea-actions";

/** A suggestion heard elsewhere (a meet-up, a mail), typed in by a member. */
export function HandEntry({ channelId }: { channelId: string }) {
  const add = useAddByHand(channelId);
  const [text, setText] = useState("");
  const [author, setAuthor] = useState("");
  const [link, setLink] = useState("");
  const [done, setDone] = useState<string | null>(null);
  const fields = add.error instanceof ApiError ? add.error.fields : {};
  function submit(event: FormEvent) {
    event.preventDefault();
    add.mutate(
      { text, author, link },
      {
        onSuccess: (answer) => {
          setDone(answer.joined ? "Added: it joined an idea already asked for." : "Added as a new idea.");
          setText("");
          setAuthor("");
          setLink("");
        },
      },
    );
  }
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4" aria-labelledby="hand-heading">
      <h2 id="hand-heading" className="font-semibold">
        Type in a suggestion
      </h2>
      <TextAreaField label="What they asked" value={text} onChange={(e) => setText(e.target.value)} error={fields.text} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Who asked (optional)" value={author} onChange={(e) => setAuthor(e.target.value)} error={fields.author} />
        <TextField label="Link (optional)" type="url" value={link} onChange={(e) => setLink(e.target.value)} error={fields.link} />
      </div>
      {done && <Notice kind="success">{done}</Notice>}
      {add.error && !Object.keys(fields).length && <Notice kind="error">{add.error.message}</Notice>}
      <div>
        <Button type="submit" tone="quiet" busy={add.isPending}>
          Add the suggestion
        </Button>
      </div>
    </form>
  );
}
