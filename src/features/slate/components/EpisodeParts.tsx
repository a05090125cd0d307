import { useEffect, useRef } from "react";
import { NavLink } from "react-router-dom";

export interface EpisodePart {
  id: string;
  title: string;
}

/**
 * The parts of the episode, one step away wherever the reader is: a column beside the work on a desk,
 * a strip that scrolls sideways under the header on a phone. The part the episode's stage works in
 * carries a cut mark, so the way back to it is plain after wandering off.
 */
export function EpisodeParts({ base, parts, open, stagePart, stageLabel }: { base: string; parts: EpisodePart[]; open: string; stagePart: string; stageLabel: string }) {
  const strip = useRef<HTMLUListElement>(null);
  // On a phone the open part's tab may sit past the strip's edge: bring it into view within the strip only.
  // The strip is `relative` so its screen-reader-only words stay inside its scroll box, not the page's.
  useEffect(() => {
    const list = strip.current;
    const tab = list?.querySelector<HTMLElement>("[aria-current='page']");
    if (!list || !tab) return;
    const left = tab.offsetLeft; // the strip is the tab's offset parent
    if (left < list.scrollLeft || left + tab.offsetWidth > list.scrollLeft + list.clientWidth) list.scrollLeft = left - 16;
  }, [open]);

  return (
    <nav aria-label="Parts of the episode" className="sticky top-0 z-10 -mx-4 border-b border-ply-300 bg-ply-100/95 px-4 py-2 backdrop-blur lg:top-4 lg:mx-0 lg:self-start lg:border-0 lg:bg-transparent lg:p-0">
      <ul ref={strip} className="relative flex gap-1 overflow-x-auto overscroll-x-contain lg:flex-col lg:gap-0.5 lg:overflow-visible">
        {parts.map((part) => (
          <li key={part.id} className="shrink-0">
            <NavLink
              to={`${base}/${part.id}`}
              className={({ isActive }) =>
                `flex items-center gap-2 whitespace-nowrap rounded-md border-b-2 px-3 py-1.5 text-sm lg:border-b-0 lg:border-l-4 lg:rounded-l-none ${
                  isActive ? "border-rust-600 bg-white font-semibold text-graphite-900" : "border-transparent text-graphite-700 hover:bg-ply-200"
                }`
              }
            >
              {part.title}
              {part.id === stagePart && (
                <span className="rounded-sm bg-amber-cut px-1 text-[0.65rem] font-bold uppercase tracking-wide text-graphite-900">
                  <span className="sr-only">(where </span>
                  {stageLabel}
                  <span className="sr-only"> works)</span>
                </span>
              )}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
