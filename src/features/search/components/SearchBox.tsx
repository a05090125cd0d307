import { useEffect, useId, useRef, useState, type KeyboardEvent } from "react";
import { SHORTEST_SEARCH, useSearch } from "../api/search-channel";
import { SearchResults } from "./SearchResults";

/** How long typing pauses before the words are sent. */
const PAUSE_MS = 200;

const typingIn = (target: EventTarget | null) =>
  target instanceof HTMLElement && (target.isContentEditable || ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName));

/**
 * The top bar's finder: "/" from anywhere reaches it; results show under it (on a desk, under the whole
 * bar at its right edge) grouped by kind, the arrow keys walk them and Enter opens one; Escape closes
 * them and goes back to the box.
 */
export function SearchBox({ channelId }: { channelId: string }) {
  const [text, setText] = useState("");
  const [query, setQuery] = useState("");
  const [open, setOpen] = useState(false);
  const box = useRef<HTMLDivElement>(null);
  const input = useRef<HTMLInputElement>(null);
  const resultsId = useId();
  const results = useSearch(channelId, query);

  useEffect(() => {
    const timer = setTimeout(() => setQuery(text.trim()), PAUSE_MS);
    return () => clearTimeout(timer);
  }, [text]);
  useEffect(() => {
    const onKey = (e: globalThis.KeyboardEvent) => {
      if (e.key !== "/" || e.ctrlKey || e.metaKey || e.altKey || typingIn(e.target)) return;
      e.preventDefault();
      input.current?.focus();
      input.current?.select();
    };
    const onPointer = (e: PointerEvent) => box.current && !box.current.contains(e.target as Node) && setOpen(false);
    window.addEventListener("keydown", onKey);
    window.addEventListener("pointerdown", onPointer);
    return () => {
      window.removeEventListener("keydown", onKey);
      window.removeEventListener("pointerdown", onPointer);
    };
  }, []);

  const links = () => [...(box.current?.querySelectorAll<HTMLAnchorElement>("[data-search-hit]") ?? [])];
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (e.key === "Escape" && open) {
      e.preventDefault();
      setOpen(false);
      input.current?.focus();
      return;
    }
    if (e.key !== "ArrowDown" && e.key !== "ArrowUp") return;
    const all = links();
    if (all.length === 0) return;
    e.preventDefault();
    setOpen(true);
    const at = all.indexOf(document.activeElement as HTMLAnchorElement);
    const next = e.key === "ArrowDown" ? Math.min(at + 1, all.length - 1) : at - 1;
    if (next < 0) input.current?.focus();
    else all[next]!.focus();
  };
  const showing = open && text.trim().length >= SHORTEST_SEARCH;

  return (
    <div ref={box} role="search" aria-label="This channel" className="relative order-last w-full sm:static sm:order-none sm:ml-auto sm:w-auto" onKeyDown={onKeyDown}>
      <label htmlFor={`${resultsId}-box`} className="sr-only">
        Find in this channel
      </label>
      <div className="flex items-center rounded-md border border-graphite-500 bg-graphite-700 focus-within:border-amber-cut">
        <input
          ref={input}
          id={`${resultsId}-box`}
          type="search"
          value={text}
          placeholder="Find…"
          autoComplete="off"
          aria-keyshortcuts="/"
          aria-controls={resultsId}
          onChange={(e) => {
            setText(e.target.value);
            setOpen(true);
          }}
          onFocus={() => setOpen(true)}
          onKeyDown={(e) => {
            if (e.key === "Enter") links()[0]?.click();
          }}
          className="w-full min-w-0 bg-transparent px-3 py-1.5 text-sm text-ply-50 placeholder:text-ply-200 focus:outline-none sm:w-24 md:w-28 lg:w-44 xl:w-64 [&::-webkit-search-cancel-button]:hidden"
        />
        <kbd aria-hidden className="mr-2 hidden rounded border border-graphite-500 px-1.5 font-mono text-xs text-ply-200 md:inline">
          /
        </kbd>
      </div>
      <div id={resultsId} hidden={!showing} className="absolute inset-x-0 top-full z-30 mt-1 sm:right-4 sm:left-auto sm:w-[34rem] sm:max-w-[calc(100vw-2rem)]">
        {showing && (
          <SearchResults
            channelId={channelId}
            typed={text.trim()}
            results={results}
            onOpen={() => setOpen(false)}
          />
        )}
      </div>
    </div>
  );
}
