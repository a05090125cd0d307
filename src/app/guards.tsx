import { Navigate, Outlet, useLocation, useParams } from "react-router-dom";
import { inAppPath } from "@shared/auth/next-path";
import { LoadError, Loading } from "../components/States";
import { useMe } from "../lib/session";

/** Pages behind sign-in: a signed-out visitor goes to sign-in and comes back afterwards. */
export function RequireSignedIn() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading />;
  if (me.isError) return <LoadError error={me.error} retry={() => void me.refetch()} />;
  if (!me.data.user) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  return <Outlet />;
}

/** Signed-out pages: a signed-in person has nothing to do there. */
export function RedirectIfSignedIn() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading />;
  if (me.data?.user) {
    const next = new URLSearchParams(location.search).get("next");
    return <Navigate to={inAppPath(next)} replace />;
  }
  return <Outlet />;
}

/** A channel the person doesn't belong to looks the same as one that doesn't exist. */
export function RequireMembership() {
  const { channelId } = useParams();
  const me = useMe();
  if (!me.data?.memberships.some((m) => m.channelId === channelId)) {
    return <LoadError error={new Error("This channel doesn't exist, or you're not a member of it.")} />;
  }
  return <Outlet />;
}

export function HomeRedirect() {
  const me = useMe();
  const first = me.data?.memberships[0];
  return <Navigate to={first ? `/c/${first.channelId}/slate` : "/channels/new"} replace />;
}
