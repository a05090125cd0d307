import { Button } from "../../../components/Button";
import { useMe } from "../../../lib/session";
import { useSendConfirmationMail } from "../api/confirm-address";

/** Shown until the signed-in person's address is confirmed: why it matters, and another mail on request. */
export function ConfirmAddressNotice() {
  const user = useMe().data?.user;
  const resend = useSendConfirmationMail();
  if (!user || user.emailVerified) return null;
  return (
    <section aria-label="Confirm your address" className="border-b border-amber-cut/60 bg-amber-cut/15">
      <div className="mx-auto flex max-w-[96rem] flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2 text-sm text-graphite-900">
        <p className="min-w-0 flex-1 basis-72">
          <strong>Confirm your address.</strong> Kerf mailed a link to <span className="break-all">{user.email}</span>. Until you open it, you can use Kerf, but it won't send
          invitations or review links for you.
        </p>
        <Button tone="quiet" busy={resend.isPending} onClick={() => resend.mutate()}>
          Send the mail again
        </Button>
        <p role="status" className="basis-full empty:hidden">
          {resend.isSuccess && `Sent to ${resend.data.sentTo ?? user.email}. It can take a minute to arrive; check the spam folder too.`}
          {resend.isError && resend.error.message}
        </p>
      </div>
    </section>
  );
}
