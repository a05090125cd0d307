import { partKindLabels, type PartView } from "./schemas";
import { figureIn } from "./comparison";

export const shelfSorts = ["name", "mass", "kind"] as const;
export type ShelfSort = (typeof shelfSorts)[number];
export const shelfSortLabels: Record<ShelfSort, string> = { name: "Name", mass: "Mass, lightest first", kind: "Kind" };

type ShelfPart = Pick<PartView, "id" | "name" | "kind" | "mass" | "supplier">;

const fold = (text: string) => text.normalize("NFKD").replace(/\p{M}/gu, "").toLocaleLowerCase();

/** Parts whose name, kind or supplier holds every word of the search, in any case and with or without accents. */
export function searchShelf<T extends ShelfPart>(parts: readonly T[], search: string): T[] {
  const words = fold(search).split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...parts];
  return parts.filter((part) => {
    const text = fold(`${part.name} ${partKindLabels[part.kind]} ${part.supplier}`);
    return words.every((word) => text.includes(word));
  });
}

const byName = (a: ShelfPart, b: ShelfPart) => fold(a.name).localeCompare(fold(b.name)) || a.id.localeCompare(b.id);

/** A sorted copy; by mass, the lightest first whatever unit each was weighed in, and unweighed parts last. */
export function sortShelf<T extends ShelfPart>(parts: readonly T[], sort: ShelfSort): T[] {
  const grams = (part: ShelfPart) => figureIn(part.mass ?? undefined, "g");
  return [...parts].sort((a, b) => {
    if (sort === "kind") return partKindLabels[a.kind].localeCompare(partKindLabels[b.kind]) || byName(a, b);
    if (sort === "mass") {
      const x = grams(a);
      const y = grams(b);
      if (x === null || y === null) return x === y ? byName(a, b) : x === null ? 1 : -1;
      return x - y || byName(a, b);
    }
    return byName(a, b);
  });
}
