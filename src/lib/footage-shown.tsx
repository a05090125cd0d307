import { createContext, useContext, type ReactNode } from "react";
import type { Role } from "@shared/access/roles";

/** A bench run or build iteration of the episode, as the footage beside it needs to know it. */
export interface ShownThing {
  kind: "run" | "iteration";
  id: string;
  number: number;
}

/** What the slot's filler receives: the run's or iteration's card says which one it is. */
export interface FootageShownProps {
  channelId: string;
  episodeId: string;
  role: Role;
  shows: ShownThing;
}

/**
 * A slot on a run's or an iteration's card for the footage that shows it. The bench names no other
 * feature: the episode page (src/app/episode-page.tsx) fills the slot with the footage's own part.
 */
type Filler = (props: FootageShownProps) => ReactNode;
const Slot = createContext<Filler | null>(null);

/** `filler` renders the footage's own part; give a function made once (module level), not one per render. */
export function FootageShownSlot({ filler, children }: { filler: Filler; children: ReactNode }) {
  return <Slot.Provider value={filler}>{children}</Slot.Provider>;
}

/** The footage that shows this run or iteration, when the page has filled the slot; nothing otherwise. */
export function FootageShown(props: FootageShownProps) {
  const fill = useContext(Slot);
  return fill ? fill(props) : null;
}
