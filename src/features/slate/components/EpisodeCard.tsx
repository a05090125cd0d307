import { memo, type CSSProperties, type KeyboardEventHandler, type PointerEventHandler } from "react";
import { useSortable } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import { Link } from "react-router-dom";
import { isAtRisk, type BoardFlag } from "@shared/slate/flags";
import type { BoardCard } from "@shared/slate/schemas";
import { Flag } from "./Flag";
import { formatDay } from "../../../lib/format";

interface CardProps {
  channelId: string;
  card: BoardCard;
  extraFlags: BoardFlag[] | undefined;
  canMove: boolean;
}

/** A card on the board that can be dragged by mouse anywhere on it, or by keyboard from its handle. */
export const SortableEpisodeCard = memo(function SortableEpisodeCard({ channelId, card, extraFlags, canMove }: CardProps) {
  const movable = canMove && !card.archivedAt;
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: card.id, disabled: !movable });
  const style: CSSProperties = { transform: CSS.Translate.toString(transform), transition };
  return (
    <li
      ref={setNodeRef}
      style={style}
      data-card-id={card.id}
      onPointerDown={movable ? (listeners?.onPointerDown as PointerEventHandler) : undefined}
      // No text selection starts under a pointer that goes on to drag: pressing on selected text starts the browser's own drag instead of a move.
      className={`relative ${movable ? "select-none" : ""} ${isDragging ? "opacity-40" : ""}`}
    >
      <CardFace channelId={channelId} card={card} extraFlags={extraFlags} withHandle={movable} />
      {movable && (
        <button
          type="button"
          ref={setActivatorNodeRef}
          {...attributes}
          onKeyDown={listeners?.onKeyDown as KeyboardEventHandler}
          aria-label={`Move ${card.title}`}
          className="absolute left-2 top-3 cursor-grab rounded p-0.5 text-graphite-500 hover:bg-ply-200 active:cursor-grabbing"
        >
          <svg viewBox="0 0 10 16" className="h-4 w-2.5" aria-hidden fill="currentColor">
            <circle cx="2" cy="3" r="1.3" />
            <circle cx="8" cy="3" r="1.3" />
            <circle cx="2" cy="8" r="1.3" />
            <circle cx="8" cy="8" r="1.3" />
            <circle cx="2" cy="13" r="1.3" />
            <circle cx="8" cy="13" r="1.3" />
          </svg>
        </button>
      )}
    </li>
  );
});

/**
 * What a card shows: title, owner, dates, days in the stage, tags and flags. Kept apart from the
 * drag wrapper and memoised, so a drag re-renders the wrappers and not every card's contents.
 */
export const CardFace = memo(function CardFace({ channelId, card, extraFlags, withHandle, lifted = false }: { channelId: string; card: BoardCard; extraFlags: BoardFlag[] | undefined; withHandle: boolean; lifted?: boolean }) {
  const flags = extraFlags ? [...card.flags, ...extraFlags] : card.flags;
  const risky = isAtRisk(card.flags);
  const late = card.stageDue !== null && risky;
  return (
    <article
      className={`rounded-md border-l-4 bg-white p-3 text-sm shadow-sm ${risky ? "border-alarm-600" : "border-amber-cut"} ${card.archivedAt ? "opacity-60" : ""} ${lifted ? "rotate-1 shadow-lg ring-2 ring-amber-cut" : ""}`}
    >
      <div className={withHandle ? "pl-4" : ""}>
        <Link to={`/c/${channelId}/episodes/${card.id}`} draggable={false} className="font-semibold leading-snug text-graphite-900 hover:text-rust-700 hover:underline">
          {card.title}
        </Link>
      </div>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-2 gap-y-0.5 text-xs text-graphite-700">
        <dt className="text-graphite-500">Owner</dt>
        <dd>{card.ownerName ?? "No owner"}</dd>
        {card.targetPublishDate && (
          <>
            <dt className="text-graphite-500">Out</dt>
            <dd>{formatDay(card.targetPublishDate)}</dd>
          </>
        )}
        {card.stageDue && card.stage !== "publish" && (
          <>
            <dt className="text-graphite-500">Due</dt>
            <dd className={late ? "font-semibold text-alarm-600" : ""}>{formatDay(card.stageDue, { withYear: false })}</dd>
          </>
        )}
        <dt className="text-graphite-500">Here</dt>
        <dd>{card.daysInStage === 0 ? "since today" : `${card.daysInStage} ${card.daysInStage === 1 ? "day" : "days"}`}</dd>
      </dl>
      {(flags.length > 0 || card.tags.length > 0 || card.archivedAt) && (
        <div className="mt-2 flex flex-wrap gap-1">
          {card.archivedAt && <Flag flag={{ code: "slate.archived", label: "Archived", tone: "info" }} />}
          {flags.map((flag) => (
            <Flag key={flag.code} flag={flag} />
          ))}
          {card.tags.slice(0, 3).map((tag) => (
            <span key={tag} className="rounded border border-ply-300 px-1.5 py-0.5 text-[0.7rem] text-graphite-500">
              #{tag}
            </span>
          ))}
        </div>
      )}
    </article>
  );
});
