import { Navigate, Outlet, useLocation, useParams } from "react-router-dom";
import { inAppPath } from "@shared/auth/next-path";
import { LoadError, QueryState } from "../components/States";
import { ApiError } from "../lib/api-client";
import { useMe } from "../lib/session";

/** Pages behind sign-in: a signed-out visitor goes to sign-in and comes back afterwards. */
export function RequireSignedIn() {
  const me = useMe();
  const location = useLocation();
  return (
    <QueryState query={me} page>
      {({ user }) => (user ? <Outlet /> : <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />)}
    </QueryState>
  );
}

/** Signed-out pages: a signed-in person has nothing to do there. */
export function RedirectIfSignedIn() {
  const me = useMe();
  const location = useLocation();
  return (
    <QueryState query={me} page>
      {({ user }) => (user ? <Navigate to={inAppPath(new URLSearchParams(location.search).get("next"))} replace /> : <Outlet />)}
    </QueryState>
  );
}

const notAMember = new ApiError(404, "not_found", "This channel doesn't exist, or you're not a member of it.");

/** A channel the person doesn't belong to looks the same as one that doesn't exist. */
export function RequireMembership() {
  const { channelId } = useParams();
  const me = useMe();
  if (!me.data?.memberships.some((m) => m.channelId === channelId)) return <LoadError error={notAMember} back={{ to: "/", label: "Your channels" }} />;
  return <Outlet />;
}

/** After sign-in, and at a channel's bare address: the member's home in that channel (their first one from "/"). */
export function HomeRedirect() {
  const me = useMe();
  const { channelId } = useParams();
  const chosen = channelId ?? me.data?.memberships[0]?.channelId;
  return <Navigate to={chosen ? `/c/${chosen}/home` : "/channels/new"} replace />;
}
