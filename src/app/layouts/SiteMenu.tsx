import { useEffect, useRef, useState } from "react";
import { NavLink, useLocation, useNavigate } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { useCurrentChannel, useMe } from "../../lib/session";
import { useSignOut } from "../../features/auth/api/sign-out";
import { ChannelSwitcher } from "../../features/channels/components/ChannelSwitcher";
import { SearchBox } from "../../features/search/components/SearchBox";
import { channelNav } from "../nav";

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 text-base font-medium sm:py-1.5 sm:text-sm ${isActive ? "bg-amber-cut text-graphite-900" : "text-ply-100 hover:bg-graphite-700"}`;

/**
 * The channel, its pages and the account. On a desk they sit in the top bar; on a phone they are a
 * sheet under the bar that covers the page until a link is followed.
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
      <div id="site-menu" className={`${sheet} sm:static sm:z-auto sm:flex sm:flex-1 sm:flex-row sm:flex-wrap sm:items-center sm:gap-4 sm:overflow-visible sm:p-0`}>
        <ChannelSwitcher />
        {channel && (
          <nav aria-label="Channel pages" className="flex flex-col gap-1 sm:flex-row sm:flex-wrap">
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
        <div className="flex flex-wrap items-center gap-3 border-t border-graphite-700 pt-4 text-sm sm:ml-auto sm:border-0 sm:pt-0">
          {user && (
            <span className="flex items-center">
              <NavLink to="/account" aria-label={`Your account (${user.name})`} className={navClass}>
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
