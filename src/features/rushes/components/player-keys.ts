/** What the player does; each has one key and its words, shown in the player and in the keys sheet. */
export type PlayerAction = "play" | "frameBack" | "frameOn" | "secondBack" | "secondOn" | "first" | "last" | "in" | "out" | "note" | "keys";

export interface PlayerKey {
  action: PlayerAction;
  /** The key as written on the sheet. */
  keys: string;
  /** The value of aria-keyshortcuts (WAI-ARIA 1.2, aria-keyshortcuts). */
  aria: string;
  does: string;
  matches: (e: Pick<KeyboardEvent, "key" | "shiftKey" | "altKey" | "ctrlKey" | "metaKey">) => boolean;
}

const plain = (key: string) => (e: Parameters<PlayerKey["matches"]>[0]) => !e.altKey && !e.ctrlKey && !e.metaKey && e.key.toLowerCase() === key.toLowerCase();
const shifted = (key: string, shift: boolean) => (e: Parameters<PlayerKey["matches"]>[0]) => plain(key)(e) && e.shiftKey === shift;

// In and out take the first letters of the trade's own words; the rest are the arrows and the keys
// web pages use for playing and for help.
export const playerKeys: PlayerKey[] = [
  { action: "play", keys: "Space", aria: "Space", does: "Play or stop", matches: plain(" ") },
  { action: "frameBack", keys: "←", aria: "ArrowLeft", does: "One frame back", matches: shifted("ArrowLeft", false) },
  { action: "frameOn", keys: "→", aria: "ArrowRight", does: "One frame on", matches: shifted("ArrowRight", false) },
  { action: "secondBack", keys: "Shift + ←", aria: "Shift+ArrowLeft", does: "One second back", matches: shifted("ArrowLeft", true) },
  { action: "secondOn", keys: "Shift + →", aria: "Shift+ArrowRight", does: "One second on", matches: shifted("ArrowRight", true) },
  { action: "first", keys: "Home", aria: "Home", does: "First frame", matches: plain("Home") },
  { action: "last", keys: "End", aria: "End", does: "Last frame", matches: plain("End") },
  { action: "in", keys: "I", aria: "I", does: "In at this frame", matches: plain("i") },
  { action: "out", keys: "O", aria: "O", does: "Out at this frame (the first frame after the moment)", matches: plain("o") },
  { action: "note", keys: "N", aria: "N", does: "Write the mark's note; Enter saves the mark", matches: plain("n") },
  { action: "keys", keys: "?", aria: "?", does: "Show these keys", matches: (e) => e.key === "?" },
];

export const keyOf = (action: PlayerAction) => playerKeys.find((k) => k.action === action)!;

/** Typing places where a letter is text, not a command. */
export function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable || target instanceof HTMLTextAreaElement || target instanceof HTMLSelectElement) return true;
  return target instanceof HTMLInputElement && !["range", "button", "checkbox", "radio"].includes(target.type);
}
