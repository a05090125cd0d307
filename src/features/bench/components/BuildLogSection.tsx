import { useState } from "react";
import { useForm } from "react-hook-form";
import { type Role, roleMay } from "@shared/access/roles";
import { formatFigure } from "@shared/bench/format";
import { unitsByDimension } from "@shared/bench/quantity";
import {
  type BuildPhotoView,
  iterationInputSchema,
  iterationOutcomeLabels,
  iterationOutcomes,
  type IterationInput,
  type IterationOutcome,
  type IterationView,
  MAX_PHOTOS_PER_ITERATION,
  type RunView,
} from "@shared/bench/schemas";
import { MAX_STILL_BYTES, stillTypes } from "@shared/rushes/limits";
import { formatSize } from "../../../lib/format";
import { Button } from "../../../components/Button";
import { FormOpener } from "../../../components/FormOpener";
import { Notice } from "../../../components/Notice";
import { allOf, Empty, QueryState } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { useOpenedRecord } from "../../../lib/conflicts";
import { useAddBuildPhoto } from "../api/add-build-photo";
import { FootageShown } from "../../../lib/footage-shown";
import { useAddIteration } from "../api/add-iteration";
import { useDeleteBuildPhoto } from "../api/delete-build-photo";
import { useBuildPhotos } from "../api/list-build-photos";
import { useDeleteIteration } from "../api/delete-iteration";
import { useBuildLog } from "../api/get-build-log";
import { useRuns } from "../api/list-runs";
import { useUpdateIteration } from "../api/update-iteration";
import { asEntered } from "./as-entered";
import { Panel } from "./marks";
import { FormActions, QuantityField, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { type QuantityText, applyServerErrors, converter, errorAt, quantityText } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

const outcomeStyles: Record<IterationOutcome, string> = {
  pending: "bg-ply-200 text-graphite-700",
  worked: "bg-moss-600 text-white",
  partly: "bg-amber-cut text-graphite-900",
  failed: "bg-alarm-600 text-white",
};

/** Numbered iterations of the build, each with its own all-up mass and the thrust-to-weight that mass gives. */
export function BuildLogSection({ channelId, episodeId, role }: EpisodeSectionProps) {
  const buildLog = allOf(useBuildLog(channelId, episodeId), useRuns(channelId, episodeId), useBuildPhotos(channelId, episodeId));
  return (
    <QueryState query={buildLog} loading="Loading the build log…">
      {([log, runs, photos]) => <BuildLog channelId={channelId} episodeId={episodeId} role={role} log={log} runs={runs} photos={photos} />}
    </QueryState>
  );
}

function BuildLog({ channelId, episodeId, role, log, runs, photos }: { channelId: string; episodeId: string; role: Role; log: IterationView[]; runs: RunView[]; photos: BuildPhotoView[] }) {
  const canWrite = roleMay(role, "bench", "W");
  const [editing, setEditing] = useState<string | null>(null);

  return (
    <div className="flex flex-col gap-4">
      {log.length === 0 ? (
        <Empty title="No iterations yet">{canWrite ? "Log the first build: what it is, what it weighs, how it went." : "Iterations appear here as the build goes."}</Empty>
      ) : (
        <ol className="flex flex-col gap-3" aria-label="Build iterations">
          {log.map((iteration) =>
            editing === iteration.id ? (
              <li key={iteration.id}>
                <Panel>
                  <IterationForm channelId={channelId} episodeId={episodeId} runs={runs} iteration={iteration} onDone={() => setEditing(null)} />
                </Panel>
              </li>
            ) : (
              <IterationItem
                key={iteration.id}
                channelId={channelId}
                episodeId={episodeId}
                iteration={iteration}
                photos={photos.filter((photo) => photo.iterationId === iteration.id)}
                role={role}
                onEdit={() => setEditing(iteration.id)}
              />
            ),
          )}
        </ol>
      )}
      {canWrite && editing === null && (
        <FormOpener label="Log an iteration">
          {(close) => (
            <Panel>
              <h3 className="mb-3 font-semibold">New iteration</h3>
              <IterationForm channelId={channelId} episodeId={episodeId} runs={runs} onDone={close} />
            </Panel>
          )}
        </FormOpener>
      )}
    </div>
  );
}

function IterationItem({
  channelId,
  episodeId,
  iteration,
  photos,
  role,
  onEdit,
}: {
  channelId: string;
  episodeId: string;
  iteration: IterationView;
  photos: BuildPhotoView[];
  role: Role;
  onEdit: () => void;
}) {
  const canWrite = roleMay(role, "bench", "W");
  const remove = useDeleteIteration(channelId, episodeId);
  return (
    <li aria-label={`Iteration ${iteration.number}`} className="grid grid-cols-[3rem_1fr] gap-3 rounded-lg border border-ply-300 bg-white p-4">
      <span className="flex size-10 items-center justify-center rounded-full bg-graphite-900 text-lg font-bold text-amber-cut" aria-hidden>
        {iteration.number}
      </span>
      <div className="min-w-0">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <p className="font-semibold">
            <span className="sr-only">Iteration {iteration.number}: </span>
            {iteration.change}
          </p>
          <span className={`rounded px-2 py-0.5 text-xs font-semibold ${outcomeStyles[iteration.outcome]}`}>{iterationOutcomeLabels[iteration.outcome]}</span>
        </div>
        <dl className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-3">
          <div>
            <dt className="text-xs text-graphite-500">All-up mass</dt>
            <dd>{iteration.allUpMass ? asEntered(iteration.allUpMass, "g") : "not weighed"}</dd>
          </div>
          <div>
            <dt className="text-xs text-graphite-500">Chosen run</dt>
            <dd>{iteration.chosenRun ? `Run ${iteration.chosenRun.number}: ${iteration.chosenRun.label}` : "none"}</dd>
          </div>
          <div>
            <dt className="text-xs text-graphite-500">Thrust-to-weight</dt>
            <dd className="text-base font-semibold">{formatFigure(iteration.thrustToWeight)}</dd>
          </div>
        </dl>
        {iteration.notes && <p className="mt-2 whitespace-pre-wrap text-sm text-graphite-700">{iteration.notes}</p>}
        <IterationPhotos channelId={channelId} episodeId={episodeId} iteration={iteration} photos={photos} canWrite={canWrite} />
        <FootageShown channelId={channelId} episodeId={episodeId} role={role} shows={{ kind: "iteration", id: iteration.id, number: iteration.number }} />
        {canWrite && (
          <div className="mt-2 flex gap-2">
            <Button tone="quiet" onClick={onEdit}>
              Edit
            </Button>
            <Button tone="danger" busy={remove.isPending} onClick={() => window.confirm(`Delete iteration ${iteration.number}?`) && remove.mutate(iteration.id)}>
              Delete
            </Button>
          </div>
        )}
      </div>
    </li>
  );
}

const photoAccept = [...new Set(Object.values(stillTypes))].join(",");

/** The iteration's photos as thumbnails, each opening full size; the crew adds and removes them. */
function IterationPhotos({ channelId, episodeId, iteration, photos, canWrite }: { channelId: string; episodeId: string; iteration: IterationView; photos: BuildPhotoView[]; canWrite: boolean }) {
  const add = useAddBuildPhoto(channelId, episodeId);
  const remove = useDeleteBuildPhoto(channelId, episodeId);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const full = photos.length >= MAX_PHOTOS_PER_ITERATION;
  if (photos.length === 0 && !canWrite) return null;

  return (
    <div className="mt-3" role="group" aria-label={`Photos of iteration ${iteration.number}`}>
      {photos.length > 0 ? (
        <ul className="flex flex-wrap gap-2">
          {photos.map((photo) => (
            <li key={photo.id} className="flex flex-col items-start gap-1">
              <a href={photo.url} target="_blank" rel="noreferrer" className="block rounded border border-ply-300 focus-visible:outline-2 focus-visible:outline-rust-600">
                <img src={photo.url} alt={`Iteration ${iteration.number}: ${photo.fileName}`} className="size-24 rounded object-cover" loading="lazy" />
              </a>
              {canWrite && (
                <button
                  type="button"
                  className="text-xs text-alarm-600 underline disabled:opacity-50"
                  disabled={remove.isPending}
                  aria-label={`Remove photo ${photo.fileName}`}
                  onClick={async () => {
                    if (!window.confirm(`Remove the photo ${photo.fileName} from iteration ${iteration.number}? It is deleted from storage too.`)) return;
                    setProblem(null);
                    setDone(null);
                    try {
                      await remove.mutateAsync(photo.id);
                      setDone(`${photo.fileName} removed.`);
                    } catch (error) {
                      setProblem((error as Error).message);
                    }
                  }}
                >
                  Remove
                </button>
              )}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-xs text-graphite-500">No photos of this iteration yet.</p>
      )}
      {canWrite && !full && (
        <label className="mt-2 inline-flex cursor-pointer items-center gap-2 rounded-md border border-ply-300 bg-ply-50 px-3 py-1.5 text-sm font-medium focus-within:outline-2 focus-within:outline-rust-600">
          {add.isPending ? "Adding the photo…" : "Add a photo"}
          <input
            type="file"
            accept={photoAccept}
            className="sr-only"
            disabled={add.isPending}
            aria-describedby={`photo-hint-${iteration.id}`}
            onChange={async (event) => {
              const file = event.target.files?.[0];
              event.target.value = "";
              if (!file) return;
              setProblem(null);
              setDone(null);
              try {
                await add.mutateAsync({ iterationId: iteration.id, file });
                setDone(`${file.name} added.`);
              } catch (error) {
                setProblem((error as Error).message);
              }
            }}
          />
        </label>
      )}
      {canWrite && (
        <p id={`photo-hint-${iteration.id}`} className="mt-1 text-xs text-graphite-500">
          {full ? `This iteration holds its ${MAX_PHOTOS_PER_ITERATION} photos; remove one to add another.` : `JPEG, PNG or WebP, up to ${formatSize(MAX_STILL_BYTES)}; at most ${MAX_PHOTOS_PER_ITERATION} photos an iteration.`}
        </p>
      )}
      <p role="status" className="sr-only">
        {done}
      </p>
      {problem && (
        <div className="mt-2">
          <Notice kind="error">{problem}</Notice>
        </div>
      )}
    </div>
  );
}

interface IterationFormValues {
  change: string;
  allUpMass: QuantityText;
  outcome: IterationOutcome;
  chosenRunId: string;
  notes: string;
}

const toValues = (iteration?: IterationView): IterationFormValues => ({
  change: iteration?.change ?? "",
  allUpMass: quantityText(iteration?.allUpMass, "g"),
  outcome: iteration?.outcome ?? "pending",
  chosenRunId: iteration?.chosenRunId ?? "",
  notes: iteration?.notes ?? "",
});

const toInput = (values: IterationFormValues, read = converter()) => ({
  change: values.change,
  allUpMass: read.quantity(values.allUpMass, "allUpMass"),
  outcome: values.outcome,
  chosenRunId: values.chosenRunId || null,
  notes: values.notes,
});

function IterationForm({ channelId, episodeId, runs, iteration, onDone }: { channelId: string; episodeId: string; runs: RunView[]; iteration?: IterationView; onDone?: () => void }) {
  const add = useAddIteration(channelId, episodeId);
  const update = useUpdateIteration(channelId, episodeId);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<IterationFormValues, unknown, IterationInput>({ resolver: schemaResolver(iterationInputSchema, toInput), defaultValues: toValues(iteration) });
  const record = useOpenedRecord<IterationView>(iteration ?? null, (current) => form.reset(toValues(current)));
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (input) => {
    setProblem(null);
    try {
      if (iteration) await update.mutateAsync({ id: iteration.id, input, version: record.version });
      else await add.mutateAsync(input);
      form.reset(toValues());
      onDone?.();
    } catch (error) {
      const message = record.conflictIn(error) ?? applyServerErrors(error, form.setError, ["change", "allUpMass", "allUpMass.value", "allUpMass.unit", "outcome", "chosenRunId", "notes"]);
      if (message) setProblem(message);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={iteration ? `Edit iteration ${iteration.number}` : "New iteration"} className="flex flex-col gap-3">
      <TextField label="What changed" placeholder="e.g. printed arms instead of aluminium" {...form.register("change")} error={errors.change?.message} />
      <div className="grid items-start gap-3 sm:grid-cols-3">
        <QuantityField label="All-up mass" valueProps={form.register("allUpMass.value")} unitProps={form.register("allUpMass.unit")} units={unitsByDimension.mass} error={errorAt(errors, "allUpMass")} hint="Weighed with everything on board." />
        <SelectField label="Outcome" options={iterationOutcomes.map((outcome) => ({ value: outcome, label: iterationOutcomeLabels[outcome] }))} {...form.register("outcome")} error={errors.outcome?.message} />
        <SelectField
          label="Thrust from run"
          options={[{ value: "", label: "No run chosen" }, ...runs.map((run) => ({ value: run.id, label: `Run ${run.number}: ${run.label}` }))]}
          {...form.register("chosenRunId")}
          error={errors.chosenRunId?.message}
        />
      </div>
      <TextAreaField label="Notes" {...form.register("notes")} error={errors.notes?.message} />
      {problem && <Notice kind="error">{problem}</Notice>}
      <FormActions submit={iteration ? "Save iteration" : "Log iteration"} busy={add.isPending || update.isPending} onCancel={onDone} />
    </form>
  );
}
