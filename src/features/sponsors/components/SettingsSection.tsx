import { useState } from "react";
import { SPEAKING_RATE_SOURCE } from "@shared/sponsors/read";
import { settingsInputSchema, speakingRateSchema } from "@shared/sponsors/schemas";
import { fieldMessages } from "@shared/http/errors";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { useSponsorSettings } from "../api/get-settings";
import { useSaveSettings } from "../api/save-settings";
import { useSaveSpeakingRate } from "../api/save-speaking-rate";
import { TextField } from "../../../components/form-fields";
import { numberFrom } from "../../../lib/forms";

/** How early reminders go out, and each host's speaking rate for the read's estimate. */
export function SettingsSection({ channelId, canEditReminders, canEditRates }: { channelId: string; canEditReminders: boolean; canEditRates: boolean }) {
  const settings = useSponsorSettings(channelId);
  return (
    <section aria-labelledby="settings-heading" className="mt-10 mb-10">
      <h2 id="settings-heading" className="mb-3 text-lg font-semibold">
        Reminders and speaking rates
      </h2>
      <QueryState query={settings} loading="Loading the reminder and speaking-rate settings…">
        {(data) => (
          <div className="grid items-start gap-6 md:grid-cols-2">
            <Reminders key={data.reminderDaysBefore} channelId={channelId} days={data.reminderDaysBefore} canEdit={canEditReminders} />
            <div className="rounded-lg border border-ply-300 bg-white p-4">
              <p className="mb-3 text-sm text-graphite-700">Read time uses the host's rate. Kerf starts everyone at {SPEAKING_RATE_SOURCE.split(";")[0]}.</p>
              <ul className="flex flex-col gap-2">
                {data.hosts.map((host) => (
                  <Rate key={`${host.userId}-${host.wordsPerMinute}`} channelId={channelId} host={host} canEdit={canEditRates} />
                ))}
              </ul>
            </div>
          </div>
        )}
      </QueryState>
    </section>
  );
}

function Reminders({ channelId, days, canEdit }: { channelId: string; days: number; canEdit: boolean }) {
  const save = useSaveSettings(channelId);
  const [value, setValue] = useState(String(days));
  const [error, setError] = useState<string | undefined>();
  const submit = async () => {
    const parsed = settingsInputSchema.safeParse({ reminderDaysBefore: numberFrom(value) });
    if (!parsed.success) return setError(fieldMessages(parsed.error.issues).reminderDaysBefore);
    setError(undefined);
    await save.mutateAsync(parsed.data).catch(() => undefined);
  };
  return (
    <div className="rounded-lg border border-ply-300 bg-white p-4">
      <p className="mb-3 text-sm text-graphite-700">
        Each item's owner gets an e-mail this many days before it is due, and another on the day it becomes late. Each goes out once per due date.
      </p>
      {canEdit ? (
        <div className="flex items-start gap-3">
          <TextField label="Days before the due date" inputMode="numeric" value={value} onChange={(e) => setValue(e.target.value)} error={error} />
          <Button className="mt-6" tone="quiet" busy={save.isPending} onClick={() => void submit()}>
            Save
          </Button>
        </div>
      ) : (
        <p className="font-medium">{days} days before the due date</p>
      )}
      {save.isError && <Notice kind="error">{save.error.message}</Notice>}
    </div>
  );
}

function Rate({ channelId, host, canEdit }: { channelId: string; host: { userId: string; name: string; role: string; wordsPerMinute: number; isDefault: boolean }; canEdit: boolean }) {
  const save = useSaveSpeakingRate(channelId);
  const [value, setValue] = useState(String(host.wordsPerMinute));
  const [error, setError] = useState<string | undefined>();
  const submit = async () => {
    const parsed = speakingRateSchema.safeParse({ wordsPerMinute: numberFrom(value) });
    if (!parsed.success) return setError(fieldMessages(parsed.error.issues).wordsPerMinute);
    setError(undefined);
    await save.mutateAsync({ userId: host.userId, ...parsed.data }).catch(() => undefined);
  };
  return (
    <li className="flex flex-wrap items-start gap-3">
      <span className="min-w-40 flex-1 pt-1.5 text-sm">
        <span className="font-medium">{host.name}</span> <span className="text-graphite-500">· {host.role}</span>
        {host.isDefault && <span className="text-graphite-500"> · default</span>}
      </span>
      {canEdit ? (
        <>
          <div className="flex w-32 flex-col gap-1">
            <input
              aria-label={`Words a minute, ${host.name}`}
              aria-invalid={error ? true : undefined}
              inputMode="numeric"
              value={value}
              onChange={(e) => setValue(e.target.value)}
              className={`rounded-md border bg-white px-3 py-1.5 ${error ? "border-alarm-600" : "border-ply-300"}`}
            />
            {error && <p className="text-xs text-alarm-600">{error}</p>}
          </div>
          <span className="pt-2 text-sm text-graphite-500">wpm</span>
          <Button tone="quiet" className="px-3 py-1.5" busy={save.isPending} onClick={() => void submit()}>
            Save
          </Button>
        </>
      ) : (
        <span className="pt-2 text-sm">{host.wordsPerMinute} wpm</span>
      )}
    </li>
  );
}
