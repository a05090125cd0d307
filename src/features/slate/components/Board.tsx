import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from "react";
import {
  closestCenter,
  DndContext,
  DragOverlay,
  getFirstCollision,
  KeyboardSensor,
  PointerSensor,
  pointerWithin,
  rectIntersection,
  useDroppable,
  useSensor,
  useSensors,
  type Announcements,
  type CollisionDetection,
  type DragEndEvent,
  type DragOverEvent,
  type DragStartEvent,
  type Over,
  type UniqueIdentifier,
} from "@dnd-kit/core";
import { arrayMove, SortableContext, verticalListSortingStrategy } from "@dnd-kit/sortable";
import type { GateProblem } from "@shared/slate/gates";
import type { Board as BoardData, BoardCard, ConflictBody } from "@shared/slate/schemas";
import { stageLabels, stages, type Stage } from "@shared/slate/stages";
import { Notice } from "../../../components/Notice";
import { ApiError } from "../../../lib/api-client";
import { gateProblemsOf, useMoveEpisode, type MoveVariables } from "../api/move-episode";
import { CardFace, SortableEpisodeCard } from "./EpisodeCard";
import { GateDialog } from "./GateDialog";
import { boardKeyboardCoordinates } from "./keyboard-coordinates";
import { StageSwitcher } from "./StageSwitcher";

type Columns = Record<Stage, string[]>;

function columnsOf(cards: BoardCard[]): Columns {
  const columns = Object.fromEntries(stages.map((s) => [s, [] as string[]])) as Columns;
  for (const card of cards) columns[card.stage].push(card.id);
  return columns;
}

const isStage = (id: UniqueIdentifier): id is Stage => (stages as readonly string[]).includes(String(id));

const instructions =
  "To move a card, focus its handle and press Space or Enter to pick it up. Arrow keys choose the column and the place; Space or Enter drops it, Escape puts it back.";

/**
 * The board: one column per stage. A drag rearranges the columns on screen as it goes; the drop
 * sends one move (stage, and the card above and below), which places the card in the cached board
 * at once and settles it when the server answers (api/move-episode.ts).
 */
export function Board({ channelId, board, canMove }: { channelId: string; board: BoardData; canMove: boolean }) {
  const move = useMoveEpisode(channelId);
  const byId = useMemo(() => new Map(board.episodes.map((card) => [card.id, card])), [board]);
  const serverColumns = useMemo(() => columnsOf(board.episodes), [board]);
  // The columns as dragged, over the board they were dragged on. After a drop they stay on screen
  // until the move places the card in the cached board (a new `board`), so the card never jumps back.
  const [drag, setDrag] = useState<{ columns: Columns; on: BoardData } | null>(null);
  const dragColumns = drag?.on === board ? drag.columns : null;
  const setDragColumns = (next: Columns | null | ((current: Columns | null) => Columns)) =>
    setDrag((current) => {
      const columns = typeof next === "function" ? next(current?.on === board ? current.columns : null) : next;
      return columns ? { columns, on: board } : null;
    });
  const columns = dragColumns ?? serverColumns;
  const columnsRef = useRef(columns);
  useLayoutEffect(() => {
    columnsRef.current = columns;
  });
  const [activeId, setActiveId] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [settled, setSettled] = useState("");
  const [gate, setGate] = useState<{ variables: MoveVariables; problems: GateProblem[] } | null>(null);
  // A phone shows one stage: the one picked, else the first that holds an episode.
  const [picked, setPicked] = useState<Stage | null>(null);
  const shown = picked ?? stages.find((s) => columns[s].length > 0) ?? stages[0];

  // After a card crosses into another column the layout shifts under the pointer; holding the last
  // target for a frame keeps the card from bouncing between the two columns (dnd-kit's own recipe).
  const lastOverId = useRef<UniqueIdentifier | null>(null);
  const justCrossed = useRef(false);
  useEffect(() => {
    const frame = requestAnimationFrame(() => {
      justCrossed.current = false;
    });
    return () => cancelAnimationFrame(frame);
  }, [dragColumns]);

  const collisions: CollisionDetection = useCallback(
    (args) => {
      // A pointer between two columns keeps the last target: guessing by the card's overlap there
      // flips between the columns as each guess moves the card. Keyboard drags have no pointer.
      const hits = args.pointerCoordinates ? pointerWithin(args) : rectIntersection(args);
      let overId = getFirstCollision(hits, "id");
      if (overId != null) {
        if (isStage(overId)) {
          const inColumn = columnsRef.current[overId];
          if (inColumn.length > 0) {
            overId = closestCenter({ ...args, droppableContainers: args.droppableContainers.filter((c) => c.id !== overId && inColumn.includes(String(c.id))) })[0]?.id ?? overId;
          }
        }
        lastOverId.current = overId;
        return [{ id: overId }];
      }
      if (justCrossed.current) lastOverId.current = args.active.id;
      return lastOverId.current ? [{ id: lastOverId.current }] : [];
    },
    [],
  );

  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }), useSensor(KeyboardSensor, { coordinateGetter: boardKeyboardCoordinates }));

  const containerOf = useCallback((id: UniqueIdentifier): Stage | null => {
    if (isStage(id)) return id;
    return stages.find((s) => columnsRef.current[s].includes(String(id))) ?? null;
  }, []);

  const titleOf = useCallback((id: UniqueIdentifier) => byId.get(String(id))?.title ?? "The card", [byId]);

  /** Where a drop would land, read from the target itself (the columns' state may not have caught up). */
  const spot = (target: Pick<Over, "id" | "data"> | null): string => {
    if (!target) return "not over a column";
    const sortable = target.data.current?.sortable as { containerId: UniqueIdentifier; index: number } | undefined;
    if (sortable && isStage(sortable.containerId)) return `in ${stageLabels[sortable.containerId]}, position ${sortable.index + 1}`;
    if (isStage(target.id)) return `at the end of ${stageLabels[target.id]}`;
    return "not over a column";
  };

  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up ${titleOf(active.id)}, ${spot(active)}.`,
    onDragOver: ({ active, over }) => `${titleOf(active.id)} is ${spot(over)}.`,
    onDragEnd: ({ active, over }) => (over ? `${titleOf(active.id)} dropped ${spot(over)}.` : `${titleOf(active.id)} put back.`),
    onDragCancel: ({ active }) => `Move cancelled. ${titleOf(active.id)} is back in ${stageLabels[byId.get(String(active.id))?.stage ?? "challenge"]}.`,
  };

  function send(variables: MoveVariables) {
    const title = titleOf(variables.episodeId);
    move.mutate(variables, {
      onSettled: () => setDrag(null),
      onSuccess: (episode) => setSettled(`${title} is now in ${stageLabels[episode.stage]}.`),
      onError: (error) => {
        const problems = gateProblemsOf(error);
        if (problems) return setGate({ variables, problems });
        if (error instanceof ApiError && error.status === 409) {
          const current = (error.body as ConflictBody | null)?.current;
          return setProblem(
            `Someone else moved or changed “${title}” a moment ago${current ? ` (it is in ${stageLabels[current.stage]} now)` : ""}. The board shows the latest; move it again if your move still applies.`,
          );
        }
        setProblem(`“${title}” didn't move: ${(error as Error).message}`);
      },
    });
  }

  function onDragStart({ active }: DragStartEvent) {
    setProblem(null);
    setActiveId(String(active.id));
    setDragColumns(serverColumns);
  }

  function onDragOver({ active, over }: DragOverEvent) {
    if (!over) return;
    const from = containerOf(active.id);
    const to = containerOf(over.id);
    if (!from || !to || from === to) return;
    const translated = active.rect.current.translated;
    const below = translated !== null && translated.top > over.rect.top + over.rect.height / 2;
    justCrossed.current = true;
    setDragColumns((current) => {
      const base = current ?? serverColumns;
      const target = base[to].filter((id) => id !== active.id);
      const overIndex = isStage(over.id) ? -1 : target.indexOf(String(over.id));
      target.splice(overIndex === -1 ? target.length : overIndex + (below ? 1 : 0), 0, String(active.id));
      return { ...base, [from]: base[from].filter((id) => id !== active.id), [to]: target };
    });
  }

  function onDragEnd({ active, over }: DragEndEvent) {
    setActiveId(null);
    const card = byId.get(String(active.id));
    const to = over ? containerOf(over.id) : null;
    if (!card || !over || !to) return setDragColumns(null);
    let list = columnsRef.current[to];
    const from = list.indexOf(card.id);
    const dropAt = isStage(over.id) ? list.length - 1 : list.indexOf(String(over.id));
    if (from !== -1 && dropAt !== -1 && from !== dropAt) list = arrayMove(list, from, dropAt);
    const index = list.indexOf(card.id);
    const afterId = list[index - 1] ?? null;
    const beforeId = list[index + 1] ?? null;
    const was = serverColumns[card.stage];
    const unchanged = to === card.stage && (was[was.indexOf(card.id) - 1] ?? null) === afterId && (was[was.indexOf(card.id) + 1] ?? null) === beforeId;
    if (unchanged) return setDragColumns(null);
    setDragColumns({ ...columnsRef.current, [to]: list });
    send({ episodeId: card.id, version: card.version, stage: to, afterId, beforeId });
  }

  const active = activeId ? byId.get(activeId) : undefined;
  return (
    <>
      {problem && (
        <div className="mb-3">
          <Notice kind="error">{problem}</Notice>
        </div>
      )}
      <p className="sr-only" role="status" aria-live="polite">
        {settled}
      </p>
      <DndContext
        sensors={sensors}
        collisionDetection={collisions}
        onDragStart={onDragStart}
        onDragOver={onDragOver}
        onDragEnd={onDragEnd}
        onDragCancel={() => {
          setActiveId(null);
          setDragColumns(null);
        }}
        accessibility={{ announcements, screenReaderInstructions: { draggable: instructions } }}
      >
        <StageSwitcher shown={shown} counts={Object.fromEntries(stages.map((s) => [s, columns[s].length])) as Record<Stage, number>} onShow={setPicked} />
        <div className="relative flex gap-3 overflow-x-auto pb-4" data-testid="board">
          {stages.map((stage, index) => (
            <Column key={stage} stage={stage} number={index + 1} current={stage === shown} ids={columns[stage]} byId={byId} channelId={channelId} flags={board.flags} canMove={canMove} />
          ))}
        </div>
        {/* The lifted card glides to its spot for a moment after a drop; a press there reaches the card beneath. */}
        <DragOverlay className="pointer-events-none">{active ? <CardFace channelId={channelId} card={active} extraFlags={board.flags[active.id]} withHandle={false} lifted /> : null}</DragOverlay>
      </DndContext>
      {gate && (
        <GateDialog
          title={titleOf(gate.variables.episodeId)}
          to={gate.variables.stage}
          problems={gate.problems}
          onCancel={() => setGate(null)}
          onConfirm={(reason) => {
            setGate(null);
            send({ ...gate.variables, reason });
          }}
        />
      )}
    </>
  );
}

/** Cards a column renders at first, and how many more each step shows: a long column renders as it is scrolled. */
const FIRST_CARDS = 8;
const MORE_CARDS = 16;

function Column({ stage, number, current, ids, byId, channelId, flags, canMove }: { stage: Stage; number: number; current: boolean; ids: string[]; byId: Map<string, BoardCard>; channelId: string; flags: BoardData["flags"]; canMove: boolean }) {
  const { setNodeRef, isOver } = useDroppable({ id: stage, data: { type: "column", count: ids.length } });
  const [shown, setShown] = useState(FIRST_CARDS);
  const list = useRef<HTMLUListElement | null>(null);
  const more = useRef<HTMLLIElement | null>(null);
  const hidden = Math.max(0, ids.length - shown);
  useEffect(() => {
    const sentinel = more.current;
    if (!sentinel || hidden === 0) return;
    const observer = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) setShown((n) => n + MORE_CARDS);
    }, { root: list.current, rootMargin: "300px" });
    observer.observe(sentinel);
    return () => observer.disconnect();
  }, [hidden]);
  const visible = hidden === 0 ? ids : ids.slice(0, shown);
  return (
    <section aria-labelledby={`lane-${stage}`} className={`${current ? "flex" : "hidden sm:flex"} relative min-w-[12.5rem] flex-1 basis-0 flex-col rounded-lg p-2 ${isOver ? "bg-amber-cut/20" : "bg-ply-200/70"}`}>
      <h2 id={`lane-${stage}`} className="flex items-baseline justify-between px-2 py-1 text-sm font-semibold text-graphite-700">
        <span>
          <span className="mr-1 text-graphite-500">{number}</span> {stageLabels[stage]}
        </span>
        {/* A bare span's aria-label is not read out; the count's words are hidden text instead. */}
        <span className="text-xs text-graphite-500">
          <span aria-hidden="true">{ids.length}</span>
          <span className="sr-only">{ids.length === 1 ? "1 episode" : `${ids.length} episodes`}</span>
        </span>
      </h2>
      <SortableContext id={stage} items={visible} strategy={verticalListSortingStrategy}>
        <ul
          ref={(node) => {
            list.current = node;
            setNodeRef(node);
          }}
          aria-labelledby={`lane-${stage}`}
          className="flex max-h-[calc(100vh-15rem)] min-h-24 flex-col gap-2 overflow-y-auto p-0.5"
        >
          {visible.map((id) => {
            const card = byId.get(id);
            return card ? <SortableEpisodeCard key={id} channelId={channelId} card={card} extraFlags={flags[id]} canMove={canMove} /> : null;
          })}
          {hidden > 0 && (
            <li ref={more} className="list-none">
              <button type="button" className="w-full rounded-md border border-dashed border-ply-300 py-2 text-xs text-graphite-700 hover:bg-ply-100" onClick={() => setShown((n) => n + MORE_CARDS)}>
                Show more ({hidden} not shown)
              </button>
            </li>
          )}
        </ul>
      </SortableContext>
    </section>
  );
}
