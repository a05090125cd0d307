import { useState } from "react";
import type { GateProblem } from "@shared/slate/gates";
import { moveEpisodeSchema } from "@shared/slate/schemas";
import { stageLabels, type Stage } from "@shared/slate/stages";
import { Button } from "../../../components/Button";
import { Dialog } from "./Dialog";

/** A forward move past missing essentials: say what is missing, and move on only with a reason. */
export function GateDialog({ title, to, problems, onCancel, onConfirm }: { title: string; to: Stage; problems: GateProblem[]; onCancel: () => void; onConfirm: (reason: string) => void }) {
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  const confirm = () => {
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
      <label htmlFor="gate-reason" className="text-sm font-medium text-graphite-700">
        Why move it on anyway? (kept in the history)
      </label>
      <textarea
        id="gate-reason"
        autoFocus
        rows={3}
        value={reason}
        onChange={(event) => setReason(event.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? "gate-reason-error" : undefined}
        className={`mt-1 w-full rounded-md border bg-white px-3 py-2 shadow-inner ${error ? "border-alarm-600" : "border-ply-300"}`}
      />
      {error && (
        <p id="gate-reason-error" className="text-sm text-alarm-600">
          {error}
        </p>
      )}
      <div className="mt-4 flex justify-end gap-2">
        <Button tone="quiet" onClick={onCancel}>
          Keep it here
        </Button>
        <Button onClick={confirm}>Move it on</Button>
      </div>
    </Dialog>
  );
}
