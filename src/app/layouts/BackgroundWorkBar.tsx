import { useEffect } from "react";
import { Link } from "react-router-dom";
import { formatSize } from "../../lib/format";
import { useBackgroundWork } from "../../lib/background-work";

/**
 * A thin band under the top bar while work started on one page goes on (files uploading): on every
 * page, with how far it is and a link back to where it started. Leaving the site would stop it, so the
 * browser asks first.
 */
export function BackgroundWorkBar() {
  const work = useBackgroundWork();
  const active = work.some((w) => w.active);
  useEffect(() => {
    if (!active) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [active]);
  if (work.length === 0) return null;
  return (
    <div className="border-b border-ply-300 bg-ply-100">
      <ul aria-label="Work in progress" className="mx-auto flex max-w-[96rem] flex-wrap gap-x-6 gap-y-1 px-4 py-1.5 text-sm">
        {work.map((w) => {
          const percent = w.total > 0 ? Math.floor((w.done / w.total) * 100) : 0;
          return (
            <li key={w.id} className="flex min-w-0 flex-wrap items-center gap-2">
              <span className="min-w-0 truncate font-medium">{w.label}</span>
              <span role="progressbar" aria-label={w.label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} className="inline-block h-2 w-24 overflow-hidden rounded-full bg-ply-300">
                <span className="block h-full bg-moss-600" style={{ width: `${percent}%` }} />
              </span>
              <span className="tabular-nums text-graphite-700">
                {percent}% · {formatSize(w.done)} of {formatSize(w.total)}
                {!w.active && " · waiting for you"}
              </span>
              <Link to={w.href} className="text-rust-700 underline">
                Go to the uploads
              </Link>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
