import type { ComponentType } from "react";
import { createBrowserRouter } from "react-router-dom";
import { Loading } from "../components/States";
import { NotFound, RouteError } from "./errors";
import { HomeRedirect, RedirectIfSignedIn, RequireMembership, RequireSignedIn } from "./guards";

/**
 * Each page's code is fetched the first time it is visited, so the sign-in page doesn't download the
 * whole app; the router waits for it before leaving the page on screen.
 */
const page =
  <M,>(load: () => Promise<M>, pick: (module: M) => ComponentType) =>
  async () => ({ Component: pick(await load()) });

export const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading page />,
    children: [
      {
        element: <RedirectIfSignedIn />,
        children: [
          { path: "/sign-in", lazy: page(() => import("../features/auth/components/SignInPage"), (m) => m.SignInPage) },
          { path: "/sign-up", lazy: page(() => import("../features/auth/components/SignUpPage"), (m) => m.SignUpPage) },
        ],
      },
      { path: "/invite/:token", lazy: page(() => import("../features/channels/components/AcceptInvitePage"), (m) => m.AcceptInvitePage) },
      { path: "/forgot-password", lazy: page(() => import("../features/auth/components/ForgotPasswordPage"), (m) => m.ForgotPasswordPage) },
      { path: "/new-password/:token", lazy: page(() => import("../features/auth/components/NewPasswordPage"), (m) => m.NewPasswordPage) },
      { path: "/verify/:token", lazy: page(() => import("../features/auth/components/VerifyEmailPage"), (m) => m.VerifyEmailPage) },
      { path: "/review/:token", lazy: page(() => import("../features/sponsors/components/ReviewPage"), (m) => m.ReviewPage) },
      { path: "/suggest/:channelId", lazy: page(() => import("../features/intake/components/SuggestPage"), (m) => m.SuggestPage) },
      { path: "/suggest/confirm/:token", lazy: page(() => import("../features/intake/components/AddressLinkPage"), (m) => m.ConfirmAddressPage) },
      { path: "/suggest/stop/:token", lazy: page(() => import("../features/intake/components/AddressLinkPage"), (m) => m.StopNewsPage) },
      { path: "/sponsor-report/:token", lazy: page(() => import("../features/sponsors/components/SponsorReportPage"), (m) => m.SponsorReportPage) },
      {
        element: <RequireSignedIn />,
        children: [
          { path: "/", element: <HomeRedirect /> },
          {
            lazy: page(() => import("./layouts/AppShell"), (m) => m.AppShell),
            children: [
              {
                errorElement: <RouteError inShell />,
                children: [
                  { path: "/account", lazy: page(() => import("./account-page"), (m) => m.AccountPageWithFeeds) },
                  { path: "/channels/new", lazy: page(() => import("../features/channels/components/NewChannelPage"), (m) => m.NewChannelPage) },
                  {
                    path: "/c/:channelId",
                    element: <RequireMembership />,
                    children: [
                      { index: true, element: <HomeRedirect /> },
                      { path: "home", lazy: page(() => import("../features/home/components/HomePage"), (m) => m.HomePage) },
                      { path: "calendar", lazy: page(() => import("../features/calendar/components/CalendarPage"), (m) => m.CalendarPage) },
                      { path: "slate", lazy: page(() => import("../features/slate/components/SlatePage"), (m) => m.SlatePage) },
                      { path: "slate/schedule", lazy: page(() => import("../features/slate/components/StageLengthsPage"), (m) => m.StageLengthsPage) },
                      { path: "episodes/:episodeId/:part?", lazy: page(() => import("./episode-page"), (m) => m.EpisodePageWithSections) },
                      { path: "intake/:ideaId?", lazy: page(() => import("../features/intake/components/IntakePage"), (m) => m.IntakePage) },
                      { path: "members", lazy: page(() => import("../features/channels/components/MembersPage"), (m) => m.MembersPage) },
                      { path: "shelf", lazy: page(() => import("../features/bench/components/ShelfPage"), (m) => m.ShelfPage) },
                      { path: "shelf/:partId", lazy: page(() => import("../features/bench/components/PartPage"), (m) => m.PartPage) },
                      { path: "rushes", lazy: page(() => import("../features/rushes/components/RushesPage"), (m) => m.RushesPage) },
                      { path: "shoot-days/:shootDayId", lazy: page(() => import("../features/rushes/components/ShootDayPage"), (m) => m.ShootDayPage) },
                      { path: "desk", lazy: page(() => import("../features/sponsors/components/DeskPage"), (m) => m.DeskPage) },
                      { path: "deals/:dealId/report", lazy: page(() => import("../features/sponsors/components/ReportPage"), (m) => m.ReportPage) },
                      { path: "sponsors", lazy: page(() => import("../features/sponsors/components/SponsorsPage"), (m) => m.SponsorsPage) },
                      { path: "money", lazy: page(() => import("../features/economics/components/MoneyPage"), (m) => m.MoneyPage) },
                    ],
                  },
                ],
              },
            ],
          },
        ],
      },
      { path: "*", element: <NotFound /> },
    ],
  },
]);
