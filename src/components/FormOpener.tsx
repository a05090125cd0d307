import { useEffect, useRef, useState, type ComponentProps, type ReactNode } from "react";
import { Button } from "./Button";

const fields = "input:not([type=hidden]):not([disabled]), select:not([disabled]), textarea:not([disabled]), button:not([disabled])";

function focusFirstField(within: HTMLElement): boolean {
  const field = within.querySelector<HTMLElement>(fields);
  field?.focus();
  return field !== null;
}

/**
 * An "add" form kept behind its button: the button opens it with the focus on its first field;
 * Cancel (the form's `close`), Escape or a finished save close it and give the focus back to the button.
 */
export function FormOpener({ label, tone, children, className = "" }: { label: string; tone?: ComponentProps<typeof Button>["tone"]; children: (close: () => void) => ReactNode; className?: string }) {
  const [open, setOpen] = useState(false);
  const button = useRef<HTMLButtonElement>(null);
  const box = useRef<HTMLDivElement>(null);
  const wasOpen = useRef(false);

  useEffect(() => {
    const wasOpenBefore = wasOpen.current;
    wasOpen.current = open;
    if (!open) {
      if (wasOpenBefore) button.current?.focus();
      return;
    }
    const within = box.current;
    if (!within || focusFirstField(within)) return;
    // A form that loads its choices first shows its fields a moment later: focus the first when it comes.
    const watch = new MutationObserver(() => focusFirstField(within) && watch.disconnect());
    watch.observe(within, { childList: true, subtree: true });
    return () => watch.disconnect();
  }, [open]);

  if (!open) {
    return (
      <div className={className}>
        <Button ref={button} tone={tone} aria-expanded={false} onClick={() => setOpen(true)}>
          {label}
        </Button>
      </div>
    );
  }
  return (
    <div
      ref={box}
      className={className}
      onKeyDown={(event) => {
        if (event.key !== "Escape") return;
        event.stopPropagation();
        setOpen(false);
      }}
    >
      {children(() => setOpen(false))}
    </div>
  );
}
