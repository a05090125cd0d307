import { useSyncExternalStore } from "react";

/**
 * Work that outlives the page it started on (an upload, say). A feature reports each piece here and
 * the app layout shows them on every page; this store knows no feature.
 */
export interface BackgroundWork {
  id: string;
  /** What the person sees, e.g. "Uploading 2 files". */
  label: string;
  done: number;
  total: number;
  /** Still moving (leaving the site would stop it), as opposed to paused or waiting on the person. */
  active: boolean;
  /** Where the work can be seen in full. */
  href: string;
}

let items: BackgroundWork[] = [];
const listeners = new Set<() => void>();

export function reportWork(work: BackgroundWork | { id: string; gone: true }) {
  const rest = items.filter((w) => w.id !== work.id);
  items = "gone" in work ? rest : [...rest, work];
  for (const listener of listeners) listener();
}

const subscribe = (listener: () => void) => {
  listeners.add(listener);
  return () => {
    listeners.delete(listener);
  };
};

export const useBackgroundWork = () => useSyncExternalStore(subscribe, () => items);
