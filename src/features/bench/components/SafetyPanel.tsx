import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { CUSTOM_HAZARD, FLYING_NOTE, SAFETY_NOTE, hazardCatalogue, hazardKinds, type HazardChoice } from "@shared/bench/hazards";
import type { HazardInput, HazardView } from "@shared/bench/schemas";
import { AskFirst } from "../../../components/AskFirst";
import { Button } from "../../../components/Button";
import { FormOpener } from "../../../components/FormOpener";
import { Notice } from "../../../components/Notice";
import { Empty } from "../../../components/States";
import { formatInstantDay } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useAddHazard } from "../api/add-hazard";
import { useCheckHazard } from "../api/check-hazard";
import { useDeleteHazard } from "../api/delete-hazard";
import { useUpdateHazard } from "../api/update-hazard";
import { Caution, Panel } from "./marks";
import { FormActions, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { applyServerErrors, lazyZodResolver } from "../../../lib/forms";
import { benchSchemas } from "../schemas-later";

const hazardResolver = lazyZodResolver<HazardInput>(async () => (await benchSchemas()).hazardInputSchema);

/** The listed hazards not on the plan yet, then "other": a listed hazard goes on a plan once. */
const hazardOptionsBesides = (listed: Set<string>) => [
  ...hazardKinds.filter((kind) => !listed.has(kind)).map((kind) => ({ value: kind, label: hazardCatalogue[kind].label })),
  { value: CUSTOM_HAZARD, label: "Other: type it in" },
];

interface Grants {
  /** May list hazards and change their precautions (the test plan). */
  canWrite: boolean;
  /** May record a check at power-on (crew too). */
  canCheck: boolean;
}

/** The build's hazards, each with its mitigation and who checked it, under the usual cautions. */
export function SafetyPanel({ channelId, episodeId, hazards, canWrite, canCheck }: { channelId: string; episodeId: string; hazards: HazardView[] } & Grants) {
  const unchecked = hazards.filter((hazard) => !hazard.checkedBy).length;
  return (
    <Panel>
      <h3 className="font-semibold">Safety</h3>
      <div className="mt-2 mb-4 flex flex-col gap-2">
        <Caution title="Local codes, ratings and licensed practice govern">
          <p>{SAFETY_NOTE}</p>
          <p className="mt-1">{FLYING_NOTE}</p>
        </Caution>
      </div>
      {hazards.length === 0 ? (
        <Empty title="No hazards listed yet">{canWrite ? "Pick this build's hazards: batteries, blades, heat, mains, flying." : "The owner or producer lists them."}</Empty>
      ) : (
        <>
          {unchecked > 0 && <p className="mb-2 text-sm font-medium text-rust-700">{unchecked === 1 ? "One hazard has" : `${unchecked} hazards have`} not been checked yet.</p>}
          <ul className="flex flex-col gap-3">
            {hazards.map((hazard) => (
              <HazardItem key={hazard.id} channelId={channelId} episodeId={episodeId} hazard={hazard} canWrite={canWrite} canCheck={canCheck} />
            ))}
          </ul>
        </>
      )}
      {canWrite && (
        <FormOpener label="Add a hazard" className="mt-4">
          {(close) => <HazardForm channelId={channelId} episodeId={episodeId} listed={new Set(hazards.map((hazard) => hazard.kind))} onDone={close} />}
        </FormOpener>
      )}
    </Panel>
  );
}

function HazardItem({ channelId, episodeId, hazard, canWrite, canCheck }: { channelId: string; episodeId: string; hazard: HazardView } & Grants) {
  const update = useUpdateHazard(channelId, episodeId);
  const check = useCheckHazard(channelId, episodeId);
  const remove = useDeleteHazard(channelId, episodeId);
  const [editing, setEditing] = useState(false);
  const [mitigation, setMitigation] = useState(hazard.mitigation);
  const [problem, setProblem] = useState<string | null>(null);
  const timeZone = useTimeZone();

  const act = async (work: Promise<unknown>) => {
    setProblem(null);
    try {
      await work;
      return true;
    } catch (error) {
      setProblem((error as Error).message);
      return false;
    }
  };

  return (
    <li className="rounded-md border border-ply-200 p-3" aria-label={hazard.title}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-semibold">{hazard.title}</p>
        <p className={`text-xs ${hazard.checkedBy ? "text-moss-600" : "text-rust-700"}`}>
          {hazard.checkedBy ? `✓ Checked by ${hazard.checkedBy.name}, ${formatInstantDay(hazard.checkedAt!, timeZone)}` : "Not checked yet"}
        </p>
      </div>
      {hazard.caution && <p className="mt-1 text-sm text-graphite-700">{hazard.caution}</p>}
      {editing ? (
        <div className="mt-2 flex flex-col gap-2">
          <TextAreaField label="Mitigation" value={mitigation} onChange={(event) => setMitigation(event.target.value)} />
          <p className="text-xs text-graphite-500">Changing the mitigation clears the check: someone checks the new one.</p>
          <div className="flex gap-2">
            <Button busy={update.isPending} onClick={async () => (await act(update.mutateAsync({ id: hazard.id, change: { mitigation } }))) && setEditing(false)}>
              Save mitigation
            </Button>
            <Button tone="quiet" onClick={() => setEditing(false)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : (
        <p className="mt-2 text-sm">
          <span className="font-medium">Mitigation: </span>
          {hazard.mitigation}
        </p>
      )}
      {(canWrite || canCheck) && !editing && (
        <div className="mt-2 flex flex-wrap gap-2">
          {canCheck && (
            <Button tone="quiet" busy={check.isPending} onClick={() => void act(check.mutateAsync({ id: hazard.id, checked: !hazard.checkedBy }))}>
              {hazard.checkedBy ? "Undo the check" : "Mark as checked by me"}
            </Button>
          )}
          {canWrite && <HazardChanges hazard={hazard} busy={remove.isPending} onEdit={() => { setMitigation(hazard.mitigation); setEditing(true); }} onRemove={() => void act(remove.mutateAsync(hazard.id))} />}
        </div>
      )}
      {problem && (
        <div className="mt-2">
          <Notice kind="error">{problem}</Notice>
        </div>
      )}
    </li>
  );
}

function HazardChanges({ hazard, busy, onEdit, onRemove }: { hazard: HazardView; busy: boolean; onEdit: () => void; onRemove: () => void }) {
  return (
    <>
      <Button tone="quiet" onClick={onEdit}>
        Edit mitigation
      </Button>
      <AskFirst label="Remove" question={`Remove “${hazard.title}” from the plan?`} yes="Yes, remove it" busy={busy} onYes={onRemove} />
    </>
  );
}

function HazardForm({ channelId, episodeId, listed, onDone }: { channelId: string; episodeId: string; listed: Set<string>; onDone: () => void }) {
  const add = useAddHazard(channelId, episodeId);
  const [problem, setProblem] = useState<string | null>(null);
  const options = hazardOptionsBesides(listed);
  const first = (options[0]?.value ?? CUSTOM_HAZARD) as HazardChoice;
  const startingValues = { kind: first, title: "", mitigation: first === CUSTOM_HAZARD ? "" : hazardCatalogue[first].suggestedMitigation };
  const form = useForm<HazardInput>({ resolver: hazardResolver, defaultValues: startingValues });
  const kind = useWatch({ control: form.control, name: "kind" });
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null);
    try {
      await add.mutateAsync(values);
      onDone();
    } catch (error) {
      const message = applyServerErrors(error, form.setError, ["kind", "title", "mitigation"]);
      if (message) setProblem(message);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New hazard" className="flex flex-col gap-3 border-t border-ply-200 pt-4">
      <h4 className="text-sm font-semibold">New hazard</h4>
      <SelectField
        label="Hazard"
        options={options}
        {...form.register("kind", {
          onChange: (event) => {
            // Offer the list's starting mitigation unless the person already wrote their own.
            const next = event.target.value as HazardChoice;
            const current = form.getValues("mitigation");
            const suggested = new Set(hazardKinds.map((k) => hazardCatalogue[k].suggestedMitigation));
            if (!current.trim() || suggested.has(current)) form.setValue("mitigation", next === CUSTOM_HAZARD ? "" : hazardCatalogue[next].suggestedMitigation);
          },
        })}
        error={errors.kind?.message}
      />
      {kind === CUSTOM_HAZARD ? <TextField label="Name of the hazard" {...form.register("title")} error={errors.title?.message} /> : <p className="text-sm text-graphite-700">{hazardCatalogue[kind].caution}</p>}
      <TextAreaField label="Mitigation" {...form.register("mitigation")} error={errors.mitigation?.message} />
      {problem && <Notice kind="error">{problem}</Notice>}
      <FormActions submit="Add hazard" busy={add.isPending} onCancel={onDone} />
    </form>
  );
}
