import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link } from "react-router-dom";
import { shootDaySchema, shotSchema, type ShootDayInput, type ShootDayView, type ShotInput, type ShotView } from "@shared/rushes/schemas";
import { shotKindLabels, shotKinds, shotPriorities, shotPriorityLabels, shotStatusLabels } from "@shared/rushes/vocabulary";
import { Button } from "../../../components/Button";
import { FormOpener } from "../../../components/FormOpener";
import { allOf, Empty, QueryState } from "../../../components/States";
import { formatDay } from "../../../lib/format";
import { useCreateShootDay } from "../api/add-shoot-day";
import { useCreateShot } from "../api/add-shot";
import { useDeleteShootDay } from "../api/delete-shoot-day";
import { useDeleteShot } from "../api/delete-shot";
import { useShootCrew } from "../api/list-shoot-crew";
import { useShootDays } from "../api/list-shoot-days";
import { useShots } from "../api/list-shots";
import { useUpdateShot } from "../api/update-shot";
import { FormActions, SelectField, TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";

/** The episode's shoot days and its shot list, with which shots already have footage. */
export function ShootPlan({ channelId, episodeId }: { channelId: string; episodeId: string }) {
  const plan = allOf(useShootDays(channelId, episodeId), useShots(channelId, episodeId));
  return (
    <QueryState query={plan} loading="Loading the shoot plan…">
      {([days, shots]) => <Plan channelId={channelId} episodeId={episodeId} days={days} shots={shots} />}
    </QueryState>
  );
}

function Plan({ channelId, episodeId, days, shots }: { channelId: string; episodeId: string; days: ShootDayView[]; shots: ShotView[] }) {
  const removeDay = useDeleteShootDay(channelId, episodeId);
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <section aria-labelledby="days-heading">
        <h3 id="days-heading" className="mb-2 font-semibold">
          Shoot days
        </h3>
        {days.length === 0 ? (
          <Empty title="No shoot days yet">Add the first day: its date, place and call time.</Empty>
        ) : (
          <ul className="divide-y divide-ply-200 rounded-lg border border-ply-300 bg-white">
            {days.map((d) => (
              <li key={d.id} className="flex flex-wrap items-center gap-3 px-4 py-2">
                <div className="flex-1">
                  <Link to={`/c/${channelId}/shoot-days/${d.id}`} className="font-semibold text-rust-700 underline">
                    {formatDay(d.day)}
                    {d.place && ` · ${d.place}`}
                  </Link>
                  <p className="text-xs text-graphite-500">
                    {d.callTime ? `Call ${d.callTime}` : "No call time"} · {d.crew.map((c) => c.name).join(", ") || "no crew named"} · {d.missingCount} of {d.shotCount} shots still to get
                  </p>
                </div>
                <Button tone="quiet" onClick={() => window.confirm(`Remove the shoot day ${formatDay(d.day)}? Its shots stay on the list.`) && removeDay.mutate(d.id)}>
                  Remove
                </Button>
              </li>
            ))}
          </ul>
        )}
        <FormOpener label="Add a shoot day" className="mt-3">
          {(close) => <ShootDayForm channelId={channelId} episodeId={episodeId} onDone={close} />}
        </FormOpener>
      </section>
      <section aria-labelledby="shots-heading">
        <h3 id="shots-heading" className="mb-2 font-semibold">
          Shot list
        </h3>
        <ShotList channelId={channelId} episodeId={episodeId} shots={shots} days={days} />
        <FormOpener label="Add a shot" className="mt-3">
          {(close) => <ShotForm channelId={channelId} episodeId={episodeId} days={days} onDone={close} />}
        </FormOpener>
      </section>
    </div>
  );
}

function ShootDayForm({ channelId, episodeId, onDone }: { channelId: string; episodeId: string; onDone: () => void }) {
  const create = useCreateShootDay(channelId, episodeId);
  const people = useShootCrew(channelId);
  const [crew, setCrew] = useState<string[]>([]);
  const [message, setMessage] = useState<string | null>(null);
  const form = useForm<ShootDayInput>({ resolver: zodResolver(shootDaySchema) as never, defaultValues: { day: "", place: "", callTime: null, crewIds: [], notes: "" } });
  const submit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await create.mutateAsync({ ...values, callTime: values.callTime || null, crewIds: crew });
      onDone();
    } catch (error) {
      setMessage(applyServerErrors(error, form.setError, ["day", "place", "callTime"]));
    }
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Add a shoot day" className="grid gap-3 rounded-lg border border-ply-300 bg-ply-50 p-3 sm:grid-cols-[10rem_1fr_8rem_auto] sm:items-start">
      <TextField label="Date" type="date" {...form.register("day")} error={form.formState.errors.day?.message} />
      <TextField label="Place" {...form.register("place")} error={form.formState.errors.place?.message} />
      <TextField label="Call time" placeholder="07:30" {...form.register("callTime", { setValueAs: (v: string) => (v ? v : null) })} error={form.formState.errors.callTime?.message} />
      <FormActions className="flex gap-2 sm:mt-6" submit="Add day" busy={create.isPending} onCancel={onDone} />
      {people.data && people.data.length > 0 && (
        <fieldset className="sm:col-span-4">
          <legend className="text-sm font-medium text-graphite-700">Crew on the day</legend>
          <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
            {people.data.map((p) => (
              <label key={p.userId} className="flex items-center gap-1.5 text-sm">
                <input
                  type="checkbox"
                  checked={crew.includes(p.userId)}
                  onChange={(e) => setCrew((c) => (e.target.checked ? [...c, p.userId] : c.filter((id) => id !== p.userId)))}
                />
                {p.name}
              </label>
            ))}
          </div>
        </fieldset>
      )}
      {message && <p className="text-sm text-alarm-600 sm:col-span-4">{message}</p>}
    </form>
  );
}

function ShotList({ channelId, episodeId, shots, days }: { channelId: string; episodeId: string; shots: ShotView[]; days: { id: string; day: string }[] }) {
  const update = useUpdateShot(channelId, episodeId);
  const remove = useDeleteShot(channelId, episodeId);
  if (shots.length === 0) return <Empty title="No shots planned">List what the edit will need before the shoot.</Empty>;
  return (
    <ul className="divide-y divide-ply-200 rounded-lg border border-ply-300 bg-white" aria-label="Shots">
      {shots.map((shot) => (
        <li key={shot.id} className="flex flex-wrap items-center gap-3 px-4 py-2">
          <span
            className={`w-20 rounded-full px-2 py-0.5 text-center text-xs font-semibold ${shot.status === "captured" ? "bg-moss-600/15 text-moss-600" : shot.status === "dropped" ? "bg-graphite-500/15 text-graphite-500 line-through" : "bg-amber-cut/25 text-graphite-900"}`}
          >
            {shotStatusLabels[shot.status]}
          </span>
          <div className="min-w-48 flex-1">
            <p className="font-medium">{shot.description}</p>
            <p className="text-xs text-graphite-500">
              {shotKindLabels[shot.kind]} · {shotPriorityLabels[shot.priority]} · {formatDay(days.find((d) => d.id === shot.shootDayId)?.day) || "no day"} · {shot.clipCount} {shot.clipCount === 1 ? "clip" : "clips"}
            </p>
          </div>
          {shot.status !== "dropped" ? (
            <Button tone="quiet" onClick={() => update.mutate({ id: shot.id, status: "dropped" })}>
              Drop
            </Button>
          ) : (
            <Button tone="quiet" onClick={() => update.mutate({ id: shot.id, status: "planned" })}>
              Plan again
            </Button>
          )}
          <Button tone="quiet" aria-label={`Remove shot ${shot.description}`} onClick={() => remove.mutate(shot.id)}>
            Remove
          </Button>
        </li>
      ))}
    </ul>
  );
}

/** Stays open after each shot, the focus back on its description, so a list is typed in one go. */
function ShotForm({ channelId, episodeId, days, onDone }: { channelId: string; episodeId: string; days: { id: string; day: string; place: string }[]; onDone: () => void }) {
  const create = useCreateShot(channelId, episodeId);
  const [message, setMessage] = useState<string | null>(null);
  const form = useForm<ShotInput>({ resolver: zodResolver(shotSchema) as never, defaultValues: { description: "", kind: "build_closeup", priority: "normal", shootDayId: null, status: "planned" } });
  const submit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await create.mutateAsync({ ...values, shootDayId: values.shootDayId || null });
      form.reset({ ...values, description: "" });
      form.setFocus("description");
    } catch (error) {
      setMessage(applyServerErrors(error, form.setError, ["description", "kind", "priority", "shootDayId"]));
    }
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Add a shot" className="grid gap-3 rounded-lg border border-ply-300 bg-ply-50 p-3 sm:grid-cols-2 lg:grid-cols-[1fr_10rem_9rem_10rem_auto] lg:items-start">
      <TextField label="Shot" placeholder="e.g. close-up of the solder joints" {...form.register("description")} error={form.formState.errors.description?.message} />
      <SelectField label="Kind" options={shotKinds.map((k) => ({ value: k, label: shotKindLabels[k] }))} {...form.register("kind")} />
      <SelectField label="Priority" options={shotPriorities.map((p) => ({ value: p, label: shotPriorityLabels[p] }))} {...form.register("priority")} />
      <SelectField
        label="Shoot day"
        options={[{ value: "", label: "Not yet" }, ...days.map((d) => ({ value: d.id, label: `${formatDay(d.day)} ${d.place}` }))]}
        {...form.register("shootDayId", { setValueAs: (v: string) => (v ? v : null) })}
      />
      <FormActions className="flex gap-2 lg:mt-6" submit="Add shot" busy={create.isPending} onCancel={onDone} />
      {message && <p className="text-sm text-alarm-600 sm:col-span-2 lg:col-span-5">{message}</p>}
    </form>
  );
}
