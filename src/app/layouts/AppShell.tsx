import { NavLink, Outlet, useNavigate, useNavigation } from "react-router-dom";
import { roleLabels, roleMay } from "@shared/access/roles";
import { Wordmark } from "../../components/Wordmark";
import { useCurrentChannel, useMe } from "../../lib/session";
import { useSignOut } from "../../features/auth/api/sign-out";
import { ConfirmAddressNotice } from "../../features/auth/components/ConfirmAddressNotice";
import { ChannelSwitcher } from "../../features/channels/components/ChannelSwitcher";
import { SearchBox } from "../../features/search/components/SearchBox";
import { channelNav } from "../nav";
import { BackgroundWorkBar } from "./BackgroundWorkBar";

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-1.5 text-sm font-medium ${isActive ? "bg-amber-cut text-graphite-900" : "text-ply-100 hover:bg-graphite-700"}`;

export function AppShell() {
  const me = useMe();
  const channel = useCurrentChannel();
  const signOut = useSignOut();
  const navigate = useNavigate();
  // A page's code is fetched on its first visit: a thin bar says the click was taken meanwhile.
  const opening = useNavigation().state !== "idle";
  const user = me.data?.user;

  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:p-2">
        Skip to content
      </a>
      {opening && <div role="status" aria-label="Opening the page" className="kerf-appear fixed inset-x-0 top-0 z-50 h-1 bg-amber-cut" />}
      <header className="bg-graphite-900 text-ply-50">
        <div className="mx-auto flex max-w-[96rem] flex-wrap items-center gap-4 px-4 py-2">
          <Wordmark className="text-lg" />
          <ChannelSwitcher />
          {channel && (
            <nav aria-label="Channel pages" className="flex flex-wrap gap-1">
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
          <div className="ml-auto flex items-center gap-3 text-sm">
            {user && (
              <span className="flex items-center">
                <NavLink to="/account" aria-label={`Your account (${user.name})`} className={navClass}>
                  {user.name}
                </NavLink>
                {channel && <span className="ml-2 rounded bg-graphite-700 px-2 py-0.5 text-xs">{roleLabels[channel.role]}</span>}
              </span>
            )}
            <button
              type="button"
              className="rounded-md border border-graphite-500 px-3 py-1 hover:bg-graphite-700"
              onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate("/sign-in", { replace: true }) })}
            >
              Sign out
            </button>
          </div>
        </div>
      </header>
      <BackgroundWorkBar />
      <ConfirmAddressNotice />
      <main id="main" className="mx-auto max-w-[96rem] px-4 py-6">
        <Outlet />
      </main>
    </div>
  );
}
