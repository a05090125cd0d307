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
      // A phone gives the whole screen to the dialog; a desk shows it as a card over the page.
      className={`m-0 h-full max-h-none w-full max-w-none border-ply-300 bg-white p-0 text-graphite-900 shadow-xl backdrop:bg-graphite-900/40 sm:m-auto sm:h-auto sm:max-h-[calc(100%-2rem)] sm:w-[calc(100%-2rem)] sm:rounded-xl sm:border ${wide ? "sm:max-w-3xl" : "sm:max-w-lg"}`}
    >
      {open && (
        <div className="p-4 sm:p-6">
          <h2 id="dialog-title" className="mb-4 text-lg font-bold">
            {title}
          </h2>
          {children}
        </div>
      )}
    </dialog>
  );
}
