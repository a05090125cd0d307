import { useEffect, useRef, type ReactNode } from "react";

/**
 * A modal on the browser's own <dialog>: it traps focus, closes on Escape and returns focus to what
 * opened it.
 */
export function Dialog({ open, title, onClose, children, wide = false }: { open: boolean; title: string; onClose: () => void; children: ReactNode; wide?: boolean }) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby="dialog-title"
      onClose={onClose}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className={`m-auto w-[calc(100%-2rem)] rounded-xl border border-ply-300 bg-white p-0 text-graphite-900 shadow-xl backdrop:bg-graphite-900/40 ${wide ? "max-w-3xl" : "max-w-lg"}`}
    >
      {open && (
        <div className="p-6">
          <h2 id="dialog-title" className="mb-4 text-lg font-bold">
            {title}
          </h2>
          {children}
        </div>
      )}
    </dialog>
  );
}
