import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { roleLabels, roleMay, roles, type Role } from "@shared/access/roles";
import { inviteSchema, type InviteInput, type Member } from "@shared/channels/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { formatInstantNamingZone } from "../../../lib/format";
import { useChannel, useMe, useTimeZone } from "../../../lib/session";
import { useChangeRole } from "../api/change-role";
import { useInvite } from "../api/invite-member";
import { useMembers } from "../api/list-members";
import { useRemoveMember } from "../api/remove-member";
import { RoleTable } from "./RoleTable";
import { useRevokeInvitation } from "../api/revoke-invitation";
import { SelectField, TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";

const roleOptions = roles.map((role) => ({ value: role, label: roleLabels[role] }));

const roleDuties: Record<Role, string> = {
  owner: "everything, including members, settings and fees",
  producer: "sponsors, deals, fees, deliverables and the schedule",
  editor: "footage, the edit and publishing; no fees",
  crew: "bench runs, build log, shot list and footage uploads",
};

export function MembersPage() {
  const channel = useChannel();
  return <Members channelId={channel.channelId} canManage={roleMay(channel.role, "members", "W")} channelName={channel.channelName} />;
}

function Members({ channelId, canManage, channelName }: { channelId: string; canManage: boolean; channelName: string }) {
  const members = useMembers(channelId);
  return (
    <div className="mx-auto max-w-4xl">
      <PageHeader title="Members" subtitle={`Who works on ${channelName}, and what each role may do.`} />
      {canManage && <InviteForm channelId={channelId} />}
      <QueryState query={members} loading="Loading members…">
        {(data) => (
          <>
            <MemberTable channelId={channelId} members={data.members} canManage={canManage} />
            <PendingInvitations channelId={channelId} invitations={data.invitations} canManage={canManage} />
          </>
        )}
      </QueryState>
      {!canManage && <p className="mt-6 text-sm text-graphite-500">Only an owner can invite people or change roles.</p>}
      <RoleTable />
    </div>
  );
}

function InviteForm({ channelId }: { channelId: string }) {
  const invite = useInvite(channelId);
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);
  const form = useForm<InviteInput>({ resolver: zodResolver(inviteSchema), defaultValues: { email: "", role: "crew" } });
  const chosenRole = useWatch({ control: form.control, name: "role" });

  const onSubmit = form.handleSubmit(async (values) => {
    setNotice(null);
    try {
      await invite.mutateAsync(values);
      setNotice({ kind: "success", text: `Invitation sent to ${values.email}. The link works once and expires in 7 days.` });
      form.reset({ email: "", role: values.role });
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ["email", "role"]);
      if (message) setNotice({ kind: "error", text: message });
    }
  });

  return (
    <section aria-labelledby="invite-heading" className="mb-8 rounded-lg border border-ply-300 bg-white p-5">
      <h2 id="invite-heading" className="mb-3 font-semibold">
        Invite someone
      </h2>
      <form onSubmit={onSubmit} noValidate className="grid items-start gap-4 sm:grid-cols-[1fr_12rem_auto]">
        <TextField label="E-mail" type="email" {...form.register("email")} error={form.formState.errors.email?.message} />
        <SelectField label="Role" options={roleOptions} {...form.register("role")} error={form.formState.errors.role?.message} />
        <Button type="submit" busy={invite.isPending} className="sm:mt-6">
          Send invitation
        </Button>
      </form>
      <p className="mt-2 text-xs text-graphite-500">{roleDuties[chosenRole]}</p>
      {notice && (
        <div className="mt-3">
          <Notice kind={notice.kind}>{notice.text}</Notice>
        </div>
      )}
    </section>
  );
}

function MemberTable({ channelId, members, canManage }: { channelId: string; members: Member[]; canManage: boolean }) {
  const me = useMe();
  const changeRole = useChangeRole(channelId);
  const remove = useRemoveMember(channelId);
  const [error, setError] = useState<string | null>(null);
  const act = async (work: Promise<unknown>) => {
    setError(null);
    try {
      await work;
    } catch (e) {
      setError((e as Error).message);
    }
  };

  return (
    <section aria-labelledby="members-heading">
      <h2 id="members-heading" className="mb-3 font-semibold">
        {members.length} {members.length === 1 ? "member" : "members"}
      </h2>
      {error && (
        <div className="mb-3">
          <Notice kind="error">{error}</Notice>
        </div>
      )}
      <ul className="divide-y divide-ply-200 rounded-lg border border-ply-300 bg-white">
        {members.map((member) => (
          <li key={member.userId} className="flex flex-wrap items-center gap-4 px-4 py-3">
            <div className="min-w-48 flex-1">
              <p className="font-medium">
                {member.name}
                {member.userId === me.data?.user?.id && <span className="ml-2 text-xs text-graphite-500">(you)</span>}
              </p>
              <p className="text-sm text-graphite-500">{member.email}</p>
            </div>
            {canManage ? (
              <>
                <label className="sr-only" htmlFor={`role-${member.userId}`}>
                  Role of {member.name}
                </label>
                <select
                  id={`role-${member.userId}`}
                  value={member.role}
                  onChange={(event) => void act(changeRole.mutateAsync({ userId: member.userId, role: event.target.value as Role }))}
                  className="rounded-md border border-ply-300 bg-white px-2 py-1"
                >
                  {roleOptions.map((o) => (
                    <option key={o.value} value={o.value}>
                      {o.label}
                    </option>
                  ))}
                </select>
                <Button
                  tone="danger"
                  onClick={() => {
                    if (window.confirm(`Remove ${member.name} from the channel?`)) void act(remove.mutateAsync(member.userId));
                  }}
                >
                  Remove
                </Button>
              </>
            ) : (
              <span className="rounded-full bg-ply-200 px-3 py-1 text-sm">{roleLabels[member.role]}</span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function PendingInvitations({ channelId, invitations, canManage }: { channelId: string; invitations: { id: string; email: string; role: Role; expiresAt: string; invitedBy: string }[]; canManage: boolean }) {
  const revoke = useRevokeInvitation(channelId);
  const timeZone = useTimeZone();
  return (
    <section aria-labelledby="pending-heading" className="mt-8">
      <h2 id="pending-heading" className="mb-3 font-semibold">
        Waiting to join
      </h2>
      {invitations.length === 0 ? (
        <Empty title="No open invitations">{canManage ? "Invite the editor, producer and crew above." : null}</Empty>
      ) : (
        <ul className="divide-y divide-ply-200 rounded-lg border border-ply-300 bg-white">
          {invitations.map((invitation) => (
            <li key={invitation.id} className="flex flex-wrap items-center gap-4 px-4 py-3">
              <div className="flex-1">
                <p className="font-medium">{invitation.email}</p>
                <p className="text-sm text-graphite-500">
                  {roleLabels[invitation.role]} · invited by {invitation.invitedBy} · expires {formatInstantNamingZone(invitation.expiresAt, timeZone)}
                </p>
              </div>
              {canManage && (
                <Button tone="quiet" busy={revoke.isPending && revoke.variables === invitation.id} onClick={() => revoke.mutate(invitation.id)}>
                  Withdraw
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
