import { useEffect, useRef } from "react";
import { Link, useParams } from "react-router-dom";
import { AuthCard } from "../../../components/AuthCard";
import { Notice } from "../../../components/Notice";
import { Loading } from "../../../components/States";
import { useMe } from "../../../lib/session";
import { useVerifyEmail } from "../api/confirm-address";

/** Where a confirmation mail's link lands: it confirms the address as soon as the page has a session. */
export function VerifyEmailPage() {
  const { token = "" } = useParams();
  const me = useMe();
  const verify = useVerifyEmail();
  const sent = useRef(false);
  const ready = me.isSuccess;

  useEffect(() => {
    // Once per page: the link works once, so a second call would only report it used.
    if (!ready || sent.current) return;
    sent.current = true;
    verify.mutate(token);
  }, [ready, token, verify]);

  const signedIn = Boolean(verify.data?.me.user ?? me.data?.user);
  const onward = signedIn ? (
    <Link className="font-semibold text-rust-600 underline" to="/">
      Go to Kerf
    </Link>
  ) : (
    <Link className="font-semibold text-rust-600 underline" to="/sign-in">
      Sign in
    </Link>
  );

  if (verify.isSuccess) {
    return (
      <AuthCard title="Address confirmed" footer={onward}>
        <Notice kind="success">
          <strong>{verify.data.confirmed}</strong> is confirmed. Kerf can now send invitations and review links for you.
        </Notice>
      </AuthCard>
    );
  }
  if (verify.isError || me.isError) {
    return (
      <AuthCard title="Confirm your address" footer={onward}>
        <Notice kind="error">{(verify.error ?? me.error)!.message}</Notice>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Confirm your address">
      <Loading label="Confirming your address…" />
    </AuthCard>
  );
}
