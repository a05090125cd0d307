import { createBrowserRouter, Link } from "react-router-dom";
import { AuthCard } from "../components/AuthCard";
import { SignInPage } from "../features/auth/components/SignInPage";
import { SignUpPage } from "../features/auth/components/SignUpPage";
import { VerifyEmailPage } from "../features/auth/components/VerifyEmailPage";
import { AcceptInvitePage } from "../features/channels/components/AcceptInvitePage";
import { MembersPage } from "../features/channels/components/MembersPage";
import { NewChannelPage } from "../features/channels/components/NewChannelPage";
import { EpisodePage } from "../features/slate/components/EpisodePage";
import { SlatePage } from "../features/slate/components/SlatePage";
import { StageLengthsPage } from "../features/slate/components/StageLengthsPage";
import { ShelfPage } from "../features/bench/components/ShelfPage";
import { PartPage } from "../features/bench/components/PartPage";
import { RushesPage } from "../features/rushes/components/RushesPage";
import { ShootDayPage } from "../features/rushes/components/ShootDayPage";
import { DeskPage } from "../features/sponsors/components/DeskPage";
import { SponsorsPage } from "../features/sponsors/components/SponsorsPage";
import { ReviewPage } from "../features/sponsors/components/ReviewPage";
import { episodeSections } from "./episode-sections";
import { HomeRedirect, RedirectIfSignedIn, RequireMembership, RequireSignedIn } from "./guards";
import { AppShell } from "./layouts/AppShell";

function NotFound() {
  return (
    <AuthCard title="Nothing here">
      <p className="mb-4 text-graphite-700">That page doesn't exist.</p>
      <Link className="font-semibold text-rust-600 underline" to="/">
        Back to Kerf
      </Link>
    </AuthCard>
  );
}

export const router = createBrowserRouter([
  {
    element: <RedirectIfSignedIn />,
    children: [
      { path: "/sign-in", element: <SignInPage /> },
      { path: "/sign-up", element: <SignUpPage /> },
    ],
  },
  { path: "/invite/:token", element: <AcceptInvitePage /> },
  { path: "/verify/:token", element: <VerifyEmailPage /> },
  { path: "/review/:token", element: <ReviewPage /> },
  {
    element: <RequireSignedIn />,
    children: [
      { path: "/", element: <HomeRedirect /> },
      {
        element: <AppShell />,
        children: [
          { path: "/channels/new", element: <NewChannelPage /> },
          {
            path: "/c/:channelId",
            element: <RequireMembership />,
            children: [
              { index: true, element: <HomeRedirect /> },
              { path: "slate", element: <SlatePage /> },
              { path: "slate/schedule", element: <StageLengthsPage /> },
              { path: "episodes/:episodeId", element: <EpisodePage sections={episodeSections} /> },
              { path: "members", element: <MembersPage /> },
              { path: "shelf", element: <ShelfPage /> },
              { path: "shelf/:partId", element: <PartPage /> },
              { path: "rushes", element: <RushesPage /> },
              { path: "shoot-days/:shootDayId", element: <ShootDayPage /> },
              { path: "desk", element: <DeskPage /> },
              { path: "sponsors", element: <SponsorsPage /> },
            ],
          },
        ],
      },
    ],
  },
  { path: "*", element: <NotFound /> },
]);
