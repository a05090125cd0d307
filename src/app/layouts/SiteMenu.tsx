import { useEffect, useRef, useState } from "react";
import { NavLink, useLocation, useNavigate } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { useCurrentChannel, useMe } from "../../lib/session";
import { useSignOut } from "../../features/auth/api/sign-out";
import { ChannelSwitcher } from "../../features/channels/components/ChannelSwitcher";
import { SearchBox } from "../../features/search/components/SearchBox";
import { channelNav } from "../nav";

const navClass = ({ isActive }: { isActive: boolean }) =>
  `shrink-0 whitespace-nowrap rounded-md px-3 py-2 text-base font-medium sm:px-2.5 sm:py-1.5 sm:text-sm lg:px-3 ${isActive ? "bg-amber-cut text-graphite-900" : "text-ply-100 hover:bg-graphite-700"}`;

/**
 * The channel, its pages and the account. On a desk the channel, the finder and the account sit in the
 * top bar's line and the pages in a strip under it (so ten pages never push the finder onto a second
 * line; where the strip is too narrow for them it scrolls sideways); on a phone they are a sheet under the bar that covers the page until a link is followed.
 */
export function SiteMenu() {
  // Open on the page it was opened on: following a link shuts it.
  const { pathname } = useLocation();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  const button = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== "Escape") return;
      setOpenOn(null);
      button.current?.focus();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [open]);
  const me = useMe();
  const channel = useCurrentChannel();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const user = me.data?.user;
  const sheet = open ? "fixed inset-x-0 top-13 bottom-0 z-40 flex flex-col gap-5 overflow-y-auto bg-graphite-900 p-4" : "hidden";
  return (
    <>
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls="site-menu"
        onClick={() => setOpenOn(open ? null : pathname)}
        className="ml-auto inline-flex items-center gap-2 rounded-md border border-graphite-500 px-3 py-1.5 text-sm font-medium hover:bg-graphite-700 sm:hidden"
      >
        <span aria-hidden className="flex w-4 flex-col gap-[3px]">
          <span className="h-0.5 bg-current" />
          <span className="h-0.5 bg-current" />
          <span className="h-0.5 bg-current" />
        </span>
        Menu
      </button>
      {/* From sm up the sheet's box goes away and its parts are laid out by the bar itself. */}
      <div id="site-menu" className={`${sheet} sm:contents`}>
        <ChannelSwitcher />
        {channel && (
          <nav
            aria-label="Channel pages"
            className="flex flex-col gap-1 sm:order-last sm:-mx-4 sm:basis-[calc(100%+2rem)] sm:flex-row sm:overflow-x-auto sm:border-t sm:border-graphite-700 sm:px-2 sm:py-1.5"
          >
            {channelNav
              .filter((entry) => roleMay(channel.role, entry.area, "R"))
              .map((entry) => (
                <NavLink key={entry.path} to={`/c/${channel.channelId}/${entry.path}`} className={navClass}>
                  {entry.label}
                </NavLink>
              ))}
          </nav>
        )}
        {channel && <SearchBox key={channel.channelId} channelId={channel.channelId} />}
        <div className="flex flex-wrap items-center gap-3 border-t border-graphite-700 pt-4 text-sm sm:flex-nowrap sm:border-0 sm:pt-0">
          {user && (
            <span className="flex items-center">
              <NavLink
                to="/account"
                aria-label={`Your account (${user.name})`}
                title={user.name}
                className={(state) => `${navClass(state)} sm:block sm:max-w-20 sm:truncate md:max-w-32 lg:max-w-56`}
              >
                {user.name}
              </NavLink>
            </span>
          )}
          <button
            type="button"
            className="rounded-md border border-graphite-500 px-3 py-1.5 hover:bg-graphite-700 sm:py-1"
            onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate("/sign-in", { replace: true }) })}
          >
            Sign out
          </button>
        </div>
      </div>
    </>
  );
}
