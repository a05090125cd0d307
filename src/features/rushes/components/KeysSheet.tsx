import { useEffect, useRef, type KeyboardEvent } from "react";
import { Button } from "../../../components/Button";
import { playerKeys } from "./player-keys";

/** The player's keys in one sheet, opened by "?" or the Keys button; Escape closes it, not the clip. */
export function KeysSheet({ open, onClose }: { open: boolean; onClose: () => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (open && !element.open) element.showModal();
    if (!open && element.open) element.close();
  }, [open]);
  const onKeyDown = (e: KeyboardEvent<HTMLDialogElement>) => {
    if (e.key !== "Escape") return;
    e.preventDefault();
    e.stopPropagation();
    onClose();
  };
  return (
    <dialog ref={dialog} aria-labelledby="player-keys-heading" onKeyDown={onKeyDown} onClose={onClose} className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-md border border-ply-300 p-5 shadow-xl backdrop:bg-graphite-900/40">
      <h3 id="player-keys-heading" className="mb-3 text-lg font-bold">
        Player keys
      </h3>
      <p className="mb-3 text-sm text-graphite-500">They work while the player has the focus (click the picture or tab to it).</p>
      <table className="w-full text-sm">
        <tbody>
          {playerKeys.map((k) => (
            <tr key={k.action} className="border-t border-ply-200">
              <th scope="row" className="py-1.5 pr-3 text-left align-top whitespace-nowrap">
                <kbd className="rounded border border-ply-300 bg-ply-50 px-1.5 font-sans">{k.keys}</kbd>
              </th>
              <td className="py-1.5">{k.does}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="mt-4 text-right">
        <Button tone="quiet" onClick={onClose} autoFocus>
          Close
        </Button>
      </div>
    </dialog>
  );
}
