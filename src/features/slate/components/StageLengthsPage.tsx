import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { defaultStageLengths, stageLengthsSchema, type StageLengths } from "@shared/slate/schedule";
import { stageLabels, stages, type Stage } from "@shared/slate/stages";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { QueryState } from "../../../components/States";
import { NumberField } from "../../../components/form-fields";
import { applyServerErrors, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";
import { useChannel } from "../../../lib/session";
import { useStageLengths } from "../api/get-stage-lengths";
import { useSaveStageLengths } from "../api/save-stage-lengths";

/** The channel's default length of each stage, in working days: what every episode's schedule counts back with. */
export function StageLengthsPage() {
  const channel = useChannel();
  return <StageLengthsEditor channelId={channel.channelId} canEdit={roleMay(channel.role, "members", "W")} />;
}

function StageLengthsEditor({ channelId, canEdit }: { channelId: string; canEdit: boolean }) {
  const settings = useStageLengths(channelId);
  return (
    <div className="mx-auto max-w-2xl">
      <Link to={`/c/${channelId}/slate`} className="text-sm text-rust-600 underline">
        ← Slate
      </Link>
      <PageHeader title="Stage lengths" subtitle="How many working days each stage usually takes. Due dates count back from each episode's publish date with these." />
      <QueryState query={settings} loading="Loading the stage lengths…" page>
        {(data) => <LengthsForm key={JSON.stringify(data.stageLengths)} channelId={channelId} initial={data.stageLengths} custom={data.custom} canEdit={canEdit} />}
      </QueryState>
    </div>
  );
}

type LengthValues = Record<Stage, string>;

const asText = (lengths: StageLengths) => Object.fromEntries(stages.map((s) => [s, String(lengths[s])])) as LengthValues;
const lengthsResolver = schemaResolver(stageLengthsSchema, (values: LengthValues) => Object.fromEntries(stages.map((s) => [s, numberFrom(values[s])])));
/** The server names a length "stageLengths.build"; the form's field is "build". */
const lengthField = (path: string) => path.replace(/^stageLengths\./, "");

function LengthsForm({ channelId, initial, custom, canEdit }: { channelId: string; initial: StageLengths; custom: boolean; canEdit: boolean }) {
  const save = useSaveStageLengths(channelId);
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);
  const form = useForm<LengthValues, unknown, StageLengths>({ resolver: lengthsResolver, defaultValues: asText(initial) });
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (lengths) => {
    setNotice(null);
    try {
      await save.mutateAsync(lengths);
      setNotice({ kind: "success", text: "Saved. Every episode's due dates now count back with these lengths." });
    } catch (error) {
      applyServerErrors(error, form.setError, stages, lengthField);
      setNotice({ kind: "error", text: (error as Error).message });
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="rounded-lg border border-ply-300 bg-white p-5">
      {!custom && <p className="mb-4 text-sm text-graphite-500">These are Kerf's starting lengths; change them to fit how your channel works.</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        {stages.map((stage) => (
          <NumberField key={stage} whole type="number" min={1} max={120} step={1} disabled={!canEdit} label={`${stageLabels[stage]} (working days)`} {...form.register(stage)} error={errors[stage]?.message} />
        ))}
      </div>
      {notice && (
        <div className="mt-4">
          <Notice kind={notice.kind}>{notice.text}</Notice>
        </div>
      )}
      {canEdit ? (
        <div className="mt-5 flex gap-2">
          <Button type="submit" busy={save.isPending}>
            Save lengths
          </Button>
          <Button type="button" tone="quiet" onClick={() => stages.forEach((s) => form.setValue(s, String(defaultStageLengths[s]), { shouldDirty: true }))}>
            Back to Kerf's starting lengths
          </Button>
        </div>
      ) : (
        <p className="mt-4 text-sm text-graphite-500">Only an owner can change the stage lengths.</p>
      )}
    </form>
  );
}
