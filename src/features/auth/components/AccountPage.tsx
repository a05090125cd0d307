import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { useNavigate } from "react-router-dom";
import { z } from "zod";
import {
  emailChangeSchema,
  knownTimeZones,
  mailTopicLabels,
  mailTopics,
  passwordChangeSchema,
  timeZoneSchema,
  type AccountSettings,
  type EmailChangeInput,
  type MailTopic,
  type PasswordChangeInput,
} from "@shared/auth/account";
import { personNameSchema } from "@shared/auth/schemas";
import { Button } from "../../../components/Button";
import { CheckboxField, SelectField, TextField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { QueryState } from "../../../components/States";
import { useOpenedRecord } from "../../../lib/conflicts";
import { browserTimeZone, formatInstant } from "../../../lib/format";
import { applyServerErrors } from "../../../lib/forms";
import { useTimeZone } from "../../../lib/session";
import { useAccountSessions, useSignOutOthers } from "../api/account-sessions";
import { useAccountSettings } from "../api/account-settings";
import { useChangeEmail } from "../api/change-email";
import { useChangePassword } from "../api/change-password";
import { useSaveProfile } from "../api/save-profile";
import { useSignOut } from "../api/sign-out";

const panel = "rounded-lg border border-ply-300 bg-white p-5";
const panelTitle = "mb-3 text-lg font-semibold";

/** The signed-in person's own account: who they are, where Kerf writes to them, their password and their sessions. */
export function AccountPage() {
  const settings = useAccountSettings();
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeader title="Your account" subtitle="These settings are yours alone and follow you into every channel." />
      <QueryState query={settings} loading="Loading your account…" page>
        {(account) => (
          <div className="flex flex-col gap-6">
            <ProfileForm key={account.id} account={account} />
            <AddressForm account={account} />
            <PasswordForm />
            <SessionsPanel />
          </div>
        )}
      </QueryState>
    </div>
  );
}

const profileForm = z.object({ name: personNameSchema, timeZone: timeZoneSchema, receive: z.array(z.string()) });
type ProfileForm = z.input<typeof profileForm>;

const formValues = (account: AccountSettings): ProfileForm => ({
  name: account.name,
  timeZone: account.timeZone,
  receive: mailTopics.filter((topic) => !account.mailOptOuts.includes(topic)),
});

function ProfileForm({ account }: { account: AccountSettings }) {
  const save = useSaveProfile();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<ProfileForm>({ resolver: zodResolver(profileForm), defaultValues: formValues(account) });
  const opened = useOpenedRecord(account, (current) => form.reset(formValues(current)));
  const here = browserTimeZone();
  const zones = knownTimeZones();
  const chosen = useWatch({ control: form.control, name: "timeZone" });
  const options = [...new Set([account.timeZone, ...zones])].map((zone) => ({ value: zone, label: zone.replaceAll("_", " ") }));

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      const saved = await save.mutateAsync({
        version: opened.version,
        name: values.name,
        timeZone: values.timeZone,
        mailOptOuts: mailTopics.filter((topic) => !values.receive.includes(topic)),
      });
      opened.startFrom(saved);
    } catch (error) {
      setFormError(opened.conflictIn(error) ?? applyServerErrors(error, form.setError, ["name", "timeZone"]));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className={panel} aria-labelledby="profile-title">
      <h2 id="profile-title" className={panelTitle}>
        About you
      </h2>
      <div className="flex flex-col gap-4">
        {formError && <Notice kind="error">{formError}</Notice>}
        {save.isSuccess && !form.formState.isDirty && <Notice kind="success">Saved.</Notice>}
        <TextField label="Your name" autoComplete="name" {...form.register("name")} error={form.formState.errors.name?.message} hint="How your channels see you, and how mentions find you." />
        <div className="flex flex-col gap-2">
          <SelectField label="Time zone" options={options} {...form.register("timeZone")} error={form.formState.errors.timeZone?.message} hint="Every time of day in Kerf is shown in this zone." />
          {chosen !== here && (
            <div className="flex flex-wrap items-center gap-2 text-sm text-graphite-700">
              <span>This device is set to {here.replaceAll("_", " ")}.</span>
              <Button type="button" tone="quiet" onClick={() => form.setValue("timeZone", here, { shouldDirty: true })}>
                Use this device's zone
              </Button>
            </div>
          )}
        </div>
        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-sm font-semibold text-graphite-900">Mail Kerf sends you</legend>
          {mailTopics.map((topic: MailTopic) => (
            <CheckboxField key={topic} label={mailTopicLabels[topic].label} hint={mailTopicLabels[topic].hint} value={topic} {...form.register("receive")} />
          ))}
          <p className="text-xs text-graphite-500">Mail about your own account (a new password, confirming an address) always comes.</p>
        </fieldset>
        <div>
          <Button type="submit" busy={save.isPending}>
            Save settings
          </Button>
        </div>
      </div>
    </form>
  );
}

function AddressForm({ account }: { account: AccountSettings }) {
  const change = useChangeEmail();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<EmailChangeInput>({ resolver: zodResolver(emailChangeSchema), defaultValues: { email: "", currentPassword: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await change.mutateAsync(values);
      form.reset();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["email", "currentPassword"]));
    }
  });
  const pending = change.data?.pendingEmail ?? account.pendingEmail;

  return (
    <form onSubmit={onSubmit} noValidate className={panel} aria-labelledby="address-title">
      <h2 id="address-title" className={panelTitle}>
        Sign-in address
      </h2>
      <div className="flex flex-col gap-4">
        <p className="text-sm text-graphite-700">
          You sign in with <strong className="break-all">{account.email}</strong>
          {account.emailVerified ? ", and it is confirmed." : ", which is not confirmed yet."}
        </p>
        {pending && (
          <Notice kind="info">
            Waiting for <strong className="break-all">{pending}</strong>: open the link Kerf mailed there to switch to it. Until then nothing changes.
          </Notice>
        )}
        {formError && <Notice kind="error">{formError}</Notice>}
        <TextField label="New address" type="email" autoComplete="email" {...form.register("email")} error={form.formState.errors.email?.message} />
        <TextField label="Current password" type="password" autoComplete="current-password" {...form.register("currentPassword")} error={form.formState.errors.currentPassword?.message} />
        <div>
          <Button type="submit" busy={change.isPending}>
            Mail a confirmation link
          </Button>
        </div>
      </div>
    </form>
  );
}

function PasswordForm() {
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<PasswordChangeInput>({ resolver: zodResolver(passwordChangeSchema), defaultValues: { currentPassword: "", newPassword: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await change.mutateAsync(values);
      form.reset();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["currentPassword", "newPassword"]));
    }
  });
  const others = change.data?.signedOut ?? 0;

  return (
    <form onSubmit={onSubmit} noValidate className={panel} aria-labelledby="password-title">
      <h2 id="password-title" className={panelTitle}>
        Password
      </h2>
      <div className="flex flex-col gap-4">
        {change.isSuccess && (
          <Notice kind="success">
            Password changed. {others === 0 ? "You were signed in nowhere else." : `${others} other ${others === 1 ? "session was" : "sessions were"} signed out.`}
          </Notice>
        )}
        {formError && <Notice kind="error">{formError}</Notice>}
        <TextField label="Current password" type="password" autoComplete="current-password" {...form.register("currentPassword")} error={form.formState.errors.currentPassword?.message} />
        <TextField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters. Every other browser signed in to your account is signed out." {...form.register("newPassword")} error={form.formState.errors.newPassword?.message} />
        <div>
          <Button type="submit" busy={change.isPending}>
            Change password
          </Button>
        </div>
      </div>
    </form>
  );
}

function SessionsPanel() {
  const sessions = useAccountSessions();
  const signOutOthers = useSignOutOthers();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const zone = useTimeZone();

  return (
    <section className={panel} aria-labelledby="sessions-title">
      <h2 id="sessions-title" className={panelTitle}>
        Where you're signed in
      </h2>
      <QueryState query={sessions} loading="Loading your sessions…">
        {({ sessions: list }) => (
          <div className="flex flex-col gap-4">
            <ul className="flex flex-col divide-y divide-ply-200" aria-label="Sessions">
              {list.map((session) => (
                <li key={session.key} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-3">
                  <span className="font-medium">
                    {session.device}
                    {session.current && <span className="ml-2 rounded bg-amber-cut/30 px-2 py-0.5 text-xs font-semibold text-graphite-900">This browser</span>}
                  </span>
                  <span className="text-sm text-graphite-700">
                    {session.startedAt ? `Signed in ${formatInstant(session.startedAt, zone)}` : "Signed in earlier"}
                    {!session.current && ` · last seen ${formatInstant(session.lastSeenAt, zone)}`}
                  </span>
                </li>
              ))}
            </ul>
            {signOutOthers.isSuccess && (
              <Notice kind="success">
                {signOutOthers.data.signedOut === 0 ? "You were signed in nowhere else." : `Signed out of ${signOutOthers.data.signedOut} other ${signOutOthers.data.signedOut === 1 ? "session" : "sessions"}.`}
              </Notice>
            )}
            {signOutOthers.isError && <Notice kind="error">{signOutOthers.error.message}</Notice>}
            <div className="flex flex-wrap gap-2">
              <Button type="button" tone="danger" busy={signOutOthers.isPending} disabled={list.length < 2} onClick={() => signOutOthers.mutate()}>
                Sign out everywhere else
              </Button>
              <Button type="button" tone="quiet" busy={signOut.isPending} onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate("/sign-in", { replace: true }) })}>
                Sign out here
              </Button>
            </div>
          </div>
        )}
      </QueryState>
    </section>
  );
}
