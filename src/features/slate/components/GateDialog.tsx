import { useEffect, useState } from "react";
import type { GateProblem } from "@shared/slate/gates";
import { stageLabels, type Stage } from "@shared/slate/stages";
import { Button } from "../../../components/Button";
import { TextAreaField } from "../../../components/form-fields";
import { slateSchemas } from "../schemas-later";
import { Dialog } from "./Dialog";

/** A forward move past missing essentials: say what is missing, and move on only with a reason. */
export function GateDialog({ title, to, problems, onCancel, onConfirm }: { title: string; to: Stage; problems: GateProblem[]; onCancel: () => void; onConfirm: (reason: string) => void }) {
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  useEffect(() => void slateSchemas(), []);
  const confirm = async () => {
    const { moveEpisodeSchema } = await slateSchemas();
    const parsed = moveEpisodeSchema.shape.reason.safeParse(reason);
    if (!parsed.success || !parsed.data) return setError(parsed.success ? "Say in a few words why it moves on anyway." : (parsed.error.issues[0]?.message ?? "Give a reason."));
    onConfirm(parsed.data);
  };
  return (
    <Dialog open title={`Move “${title}” to ${stageLabels[to]}?`} onClose={onCancel}>
      <p className="mb-2 text-sm text-graphite-700">Some essentials are missing:</p>
      <ul className="mb-4 list-disc space-y-1 pl-5 text-sm">
        {problems.map((p) => (
          <li key={p.code}>{p.message}</li>
        ))}
      </ul>
      <TextAreaField label="Why move it on anyway? (kept in the history)" autoFocus value={reason} onChange={(event) => setReason(event.target.value)} error={error ?? undefined} className="w-full" />
      <div className="mt-4 flex justify-end gap-2">
        <Button tone="quiet" onClick={onCancel}>
          Keep it here
        </Button>
        <Button onClick={() => void confirm()}>Move it on</Button>
      </div>
    </Dialog>
  );
}
