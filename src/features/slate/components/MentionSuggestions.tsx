import { useId, useState, type ChangeEvent, type KeyboardEvent, type RefObject, type SyntheticEvent } from "react";
import { completeMention, mentionAt, mentionSuggestions, type Mentionable } from "@shared/slate/mentions";

/**
 * Suggestions for the "@name" being typed in a comment: a list under the box. Arrow keys move
 * through it, Enter or Tab takes the highlighted name, Escape closes it, and a click works too.
 * The box keeps the focus throughout (aria-activedescendant names the highlighted member).
 */
export function useMentionSuggestions({ box, text, setText, people }: { box: RefObject<HTMLTextAreaElement | null>; text: string; setText: (next: string) => void; people: readonly Mentionable[] }) {
  const listId = useId();
  const [caret, setCaret] = useState(0);
  const [highlight, setHighlight] = useState(0);
  const [dismissedAt, setDismissedAt] = useState<number | null>(null);
  const typing = mentionAt(text, caret);
  const options = typing && dismissedAt !== typing.start ? mentionSuggestions(typing.query, people) : [];
  const open = options.length > 0;
  const active = Math.min(highlight, options.length - 1);

  const choose = (person: Mentionable) => {
    const done = completeMention(text, caret, person.name);
    setText(done.text);
    setCaret(done.caret);
    requestAnimationFrame(() => {
      box.current?.focus();
      box.current?.setSelectionRange(done.caret, done.caret);
    });
  };

  const onKeyDown = (event: KeyboardEvent<HTMLTextAreaElement>) => {
    if (!open) return;
    const moves: Record<string, () => void> = {
      ArrowDown: () => setHighlight((active + 1) % options.length),
      ArrowUp: () => setHighlight((active - 1 + options.length) % options.length),
      Enter: () => choose(options[active]!),
      Tab: () => choose(options[active]!),
      Escape: () => setDismissedAt(typing!.start),
    };
    const move = moves[event.key];
    if (!move || event.shiftKey || event.altKey || event.ctrlKey || event.metaKey) return;
    event.preventDefault();
    move();
  };

  // React also reports "select" when only the keys moved through the list: a highlight stays unless the caret moved.
  const track = (at: number) => {
    if (at === caret) return;
    setCaret(at);
    setHighlight(0);
  };

  const boxProps = {
    "aria-autocomplete": "list" as const,
    "aria-controls": open ? listId : undefined,
    "aria-activedescendant": open ? `${listId}-${active}` : undefined,
    onKeyDown,
    onChange: (event: ChangeEvent<HTMLTextAreaElement>) => {
      setText(event.target.value);
      track(event.target.selectionStart);
    },
    onSelect: (event: SyntheticEvent<HTMLTextAreaElement>) => track(event.currentTarget.selectionStart),
  };

  const list = open ? (
    <ul id={listId} role="listbox" aria-label="Members to mention" className="mt-1 max-w-sm rounded-md border border-ply-300 bg-white py-1 text-sm shadow-md">
      {options.map((person, i) => (
        <li
          key={person.id}
          id={`${listId}-${i}`}
          role="option"
          aria-selected={i === active}
          className={`cursor-pointer px-3 py-1.5 ${i === active ? "bg-amber-cut/30 font-semibold" : "hover:bg-ply-100"}`}
          onMouseDown={(event) => {
            event.preventDefault();
            choose(person);
          }}
        >
          @{person.name}
        </li>
      ))}
    </ul>
  ) : null;

  return { boxProps, list };
}
