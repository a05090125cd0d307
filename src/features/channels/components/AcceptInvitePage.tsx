import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link, useNavigate, useParams } from "react-router-dom";
import { z } from "zod";
import { roleLabels } from "@shared/access/roles";
import { passwordSchema, personNameSchema } from "@shared/auth/schemas";
import type { InvitationPreview } from "@shared/channels/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { allOf, QueryState } from "../../../components/States";
import { useMe } from "../../../lib/session";
import { AuthCard } from "../../../components/AuthCard";
import { useAcceptInvitation } from "../api/accept-invitation";
import { useInvitation } from "../api/get-invitation";
import { TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";

const newcomerSchema = z.object({ name: personNameSchema, password: passwordSchema });
type Newcomer = z.infer<typeof newcomerSchema>;

const closedText: Record<Exclude<InvitationPreview["state"], "open">, string> = {
  accepted: "This invitation has already been used.",
  expired: "This invitation has expired.",
  revoked: "This invitation was withdrawn.",
  closed: "This invitation is closed: its addressee has already joined the channel.",
};

export function AcceptInvitePage() {
  const { token = "" } = useParams();
  const invitation = useInvitation(token);
  const me = useMe();

  const preview = invitation.data;
  const open = preview?.state === "open";
  return (
    <AuthCard
      title={open ? `Join ${preview.channelName}` : "Invitation"}
      footer={preview && !open ? <Link className="font-semibold text-rust-600 underline" to="/sign-in">Go to sign-in</Link> : undefined}
    >
      <QueryState query={allOf(invitation, me)} missing={invalidLink}>
        {([preview, { user }]) => <Invitation token={token} preview={preview} signedIn={user ?? null} />}
      </QueryState>
    </AuthCard>
  );
}

const invalidLink = { title: "This invitation link is not valid", text: "Check that you copied all of it, or ask for a new one." };

function Invitation({ token, preview, signedIn }: { token: string; preview: InvitationPreview; signedIn: { name: string; email: string } | null }) {
  if (preview.state !== "open") return <Notice kind="error">{closedText[preview.state]} Ask the owner of {preview.channelName} for a new one.</Notice>;
  return (
    <>
      <p className="mb-4 text-graphite-700">
        {preview.invitedBy} invited <strong>{preview.email}</strong> to join as <strong>{roleLabels[preview.role].toLowerCase()}</strong>.
      </p>
      {signedIn ? (
        signedIn.email === preview.email ? (
          <JoinAsSignedIn token={token} name={signedIn.name} />
        ) : (
          <OtherAddress invited={preview.email} signedInAs={signedIn.email} />
        )
      ) : preview.hasAccount ? (
        <SignInFirst token={token} />
      ) : (
        <JoinAsNewcomer token={token} />
      )}
    </>
  );
}

function useJoin(token: string) {
  const navigate = useNavigate();
  const accept = useAcceptInvitation(token);
  return {
    accept,
    join: async (input: Newcomer | Record<string, never>) => {
      const { channelId } = await accept.mutateAsync(input);
      navigate(`/c/${channelId}/home`, { replace: true });
    },
  };
}

function JoinAsSignedIn({ token, name }: { token: string; name: string }) {
  const { accept, join } = useJoin(token);
  return (
    <div className="flex flex-col gap-3">
      {accept.isError && <Notice kind="error">{accept.error.message}</Notice>}
      <Button busy={accept.isPending} onClick={() => void join({}).catch(() => undefined)}>
        Join as {name}
      </Button>
    </div>
  );
}

/** Only the invited address may join: say so before anyone presses a button that would be refused. */
function OtherAddress({ invited, signedInAs }: { invited: string; signedInAs: string }) {
  return (
    <Notice kind="error">
      This invitation is for <strong className="break-all">{invited}</strong>, and you are signed in as <span className="break-all">{signedInAs}</span>. Sign out (in{" "}
      <Link className="font-semibold underline" to="/">
        Kerf
      </Link>
      ), then open this link again to join with {invited}.
    </Notice>
  );
}

function SignInFirst({ token }: { token: string }) {
  return (
    <Notice>
      An account with this address exists.{" "}
      <Link className="font-semibold underline" to={`/sign-in?next=${encodeURIComponent(`/invite/${token}`)}`}>
        Sign in
      </Link>{" "}
      and you'll come back here to join.
    </Notice>
  );
}

function JoinAsNewcomer({ token }: { token: string }) {
  const { accept, join } = useJoin(token);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<Newcomer>({ resolver: zodResolver(newcomerSchema), defaultValues: { name: "", password: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await join(values);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["name", "password"]));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {formError && <Notice kind="error">{formError}</Notice>}
      <TextField label="Your name" autoComplete="name" autoFocus {...form.register("name")} error={form.formState.errors.name?.message} />
      <TextField label="Choose a password" type="password" autoComplete="new-password" hint="At least 10 characters." {...form.register("password")} error={form.formState.errors.password?.message} />
      <Button type="submit" busy={accept.isPending}>
        Create account and join
      </Button>
    </form>
  );
}
