import { useState } from "react";
import { Link } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { fieldMessages } from "@shared/http/errors";
import { defaultStageLengths, stageLengthsSchema, type StageLengths } from "@shared/slate/schedule";
import { stageLabels, stages } from "@shared/slate/stages";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { LoadError, Loading } from "../../../components/States";
import { ApiError } from "../../../lib/api-client";
import { useCurrentChannel } from "../../../lib/session";
import { useSaveStageLengths, useStageLengths } from "../api/stage-lengths";

/** The channel's default length of each stage, in working days: what every episode's schedule counts back with. */
export function StageLengthsPage() {
  const channel = useCurrentChannel();
  if (!channel) return <Loading />;
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
      {settings.isPending && <Loading />}
      {settings.isError && <LoadError error={settings.error} retry={() => void settings.refetch()} />}
      {settings.data && <LengthsForm key={JSON.stringify(settings.data.stageLengths)} channelId={channelId} initial={settings.data.stageLengths} custom={settings.data.custom} canEdit={canEdit} />}
    </div>
  );
}

function LengthsForm({ channelId, initial, custom, canEdit }: { channelId: string; initial: StageLengths; custom: boolean; canEdit: boolean }) {
  const save = useSaveStageLengths(channelId);
  const [values, setValues] = useState<Record<string, string>>(Object.fromEntries(stages.map((s) => [s, String(initial[s])])));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);

  const submit = async () => {
    setNotice(null);
    const candidate = Object.fromEntries(stages.map((s) => [s, values[s]?.trim() === "" ? Number.NaN : Number(values[s])]));
    const parsed = stageLengthsSchema.safeParse(candidate);
    if (!parsed.success) return setErrors(fieldMessages(parsed.error.issues));
    setErrors({});
    try {
      await save.mutateAsync(parsed.data);
      setNotice({ kind: "success", text: "Saved. Every episode's due dates now count back with these lengths." });
    } catch (error) {
      if (error instanceof ApiError) setErrors(Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k.replace(/^stageLengths\./, ""), v])));
      setNotice({ kind: "error", text: (error as Error).message });
    }
  };

  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      className="rounded-lg border border-ply-300 bg-white p-5"
    >
      {!custom && <p className="mb-4 text-sm text-graphite-500">These are Kerf's starting lengths; change them to fit how your channel works.</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        {stages.map((stage) => (
          <div key={stage} className="flex flex-col gap-1">
            <label htmlFor={`len-${stage}`} className="text-sm font-medium text-graphite-700">
              {stageLabels[stage]} (working days)
            </label>
            <input
              id={`len-${stage}`}
              type="number"
              min={1}
              max={120}
              step={1}
              disabled={!canEdit}
              value={values[stage]}
              onChange={(e) => setValues({ ...values, [stage]: e.target.value })}
              aria-invalid={errors[stage] ? true : undefined}
              aria-describedby={errors[stage] ? `len-${stage}-error` : undefined}
              className={`rounded-md border bg-white px-3 py-2 shadow-inner disabled:bg-ply-100 ${errors[stage] ? "border-alarm-600" : "border-ply-300"}`}
            />
            {errors[stage] && (
              <p id={`len-${stage}-error`} className="text-sm text-alarm-600">
                {errors[stage]}
              </p>
            )}
          </div>
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
          <Button type="button" tone="quiet" onClick={() => setValues(Object.fromEntries(stages.map((s) => [s, String(defaultStageLengths[s])])))}>
            Back to Kerf's starting lengths
          </Button>
        </div>
      ) : (
        <p className="mt-4 text-sm text-graphite-500">Only an owner can change the stage lengths.</p>
      )}
    </form>
  );
}
