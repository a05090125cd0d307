import { useEffect, useRef, useState, type ReactNode } from "react";
import { Button } from "./Button";

/**
 * A destructive button that asks in place before it acts: the question and two answers replace it,
 * the safe answer takes the focus, and Escape keeps things as they were.
 */
export function AskFirst({ label, question, yes, busy, onYes }: { label: string; question: ReactNode; yes: string; busy?: boolean; onYes: () => void }) {
  const [asking, setAsking] = useState(false);
  const keep = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (asking) keep.current?.focus();
  }, [asking]);
  if (!asking) {
    return (
      <Button tone="danger" busy={busy} onClick={() => setAsking(true)}>
        {label}
      </Button>
    );
  }
  return (
    <span role="group" aria-label={label} className="inline-flex flex-wrap items-center gap-2" onKeyDown={(event) => event.key === "Escape" && setAsking(false)}>
      <span className="text-sm font-medium">{question}</span>
      <Button
        tone="danger"
        busy={busy}
        onClick={() => {
          setAsking(false);
          onYes();
        }}
      >
        {yes}
      </Button>
      <Button tone="quiet" ref={keep} onClick={() => setAsking(false)}>
        Keep it
      </Button>
    </span>
  );
}
