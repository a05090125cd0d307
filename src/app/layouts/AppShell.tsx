import { Outlet, useNavigation } from "react-router-dom";
import { roleLabels } from "@shared/access/roles";
import { Wordmark } from "../../components/Wordmark";
import { useCurrentChannel } from "../../lib/session";
import { ConfirmAddressNotice } from "../../features/auth/components/ConfirmAddressNotice";
import { BackgroundWorkBar } from "./BackgroundWorkBar";
import { SiteMenu } from "./SiteMenu";

export function AppShell() {
  const channel = useCurrentChannel();
  // A page's code is fetched on its first visit: a thin bar says the click was taken meanwhile.
  const opening = useNavigation().state !== "idle";

  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:p-2">
        Skip to content
      </a>
      {/* The region stays in the page so a screen reader hears the words when they appear. */}
      <p role="status" className="sr-only">
        {opening ? "Opening the page…" : ""}
      </p>
      {opening && <div aria-hidden className="kerf-appear fixed inset-x-0 top-0 z-50 h-1 bg-amber-cut" />}
      <header className="relative bg-graphite-900 text-ply-50">
        {/* Positioned so the finder's results open under the whole bar, at its right edge. */}
        <div className="relative mx-auto flex h-13 max-w-[96rem] items-center gap-4 px-4 sm:h-auto sm:flex-wrap sm:gap-x-3 sm:gap-y-2 sm:pt-2">
          <Wordmark className="text-lg" />
          {/* On a phone the bar holds the mark, the channel's role and the menu button; the rest opens as a sheet.
              From sm up the menu's parts join this line, and the channel's pages take a strip of their own under it. */}
          {channel && <span className="rounded bg-graphite-700 px-2 py-0.5 text-xs">{roleLabels[channel.role]}</span>}
          <SiteMenu />
        </div>
      </header>
      <BackgroundWorkBar />
      <ConfirmAddressNotice />
      <main id="main" className="mx-auto max-w-[96rem] px-4 py-4 sm:py-6">
        <Outlet />
      </main>
    </div>
  );
}
