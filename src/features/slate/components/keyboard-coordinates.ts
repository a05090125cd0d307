import { closestCorners, getFirstCollision, KeyboardCode, type DroppableContainer, type KeyboardCoordinateGetter } from "@dnd-kit/core";

const directions: string[] = [KeyboardCode.Down, KeyboardCode.Right, KeyboardCode.Up, KeyboardCode.Left];

/**
 * Arrow keys across several sortable columns (after dnd-kit's multiple-containers example): up and
 * down step through the cards, left and right jump to the nearest card in the next column, or into
 * the column itself when it is empty.
 */
export const boardKeyboardCoordinates: KeyboardCoordinateGetter = (event, { context: { active, droppableRects, droppableContainers, collisionRect } }) => {
  if (!directions.includes(event.code)) return undefined;
  event.preventDefault();
  if (!active || !collisionRect) return undefined;

  const candidates: DroppableContainer[] = [];
  for (const entry of droppableContainers.getEnabled()) {
    if (!entry || entry.disabled || entry.id === active.id) continue;
    const rect = droppableRects.get(entry.id);
    if (!rect) continue;
    const data = entry.data.current as { type?: string; count?: number } | undefined;
    // A column with cards is reached through its cards; an empty one is a target of its own.
    if (data?.type === "column" && (data.count ?? 0) > 0) continue;
    const fits =
      (event.code === KeyboardCode.Down && collisionRect.top < rect.top) ||
      (event.code === KeyboardCode.Up && collisionRect.top > rect.top) ||
      (event.code === KeyboardCode.Left && collisionRect.left >= rect.left + rect.width) ||
      (event.code === KeyboardCode.Right && collisionRect.left + collisionRect.width <= rect.left);
    if (fits) candidates.push(entry);
  }
  const closestId = getFirstCollision(closestCorners({ active, collisionRect, droppableRects, droppableContainers: candidates, pointerCoordinates: null }), "id");
  if (closestId == null) return undefined;
  const target = droppableContainers.get(closestId);
  const rect = target?.rect.current;
  if (!target?.node.current || !rect) return undefined;
  if ((target.data.current as { type?: string } | undefined)?.type === "column") return { x: rect.left + 8, y: rect.top + 8 };
  return { x: rect.left, y: rect.top };
};
