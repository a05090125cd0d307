import { useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { anchorLabels, describeDating, deliverableKindLabels, deliverableKinds, suggestedTemplateItems, templateAnchors } from "@shared/sponsors/deliverables";
import { templateInputSchema, type DealTemplate } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { Empty, QueryState } from "../../../components/States";
import { useOpenedRecord } from "../../../lib/conflicts";
import { useDeleteTemplate } from "../api/delete-template";
import { useTemplates } from "../api/list-templates";
import { useSaveTemplate } from "../api/save-template";
import { TextField } from "../../../components/form-fields";
import { applyServerErrors, errorAt, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

const ownerRoleLabels = { "": "Whoever makes the deal", owner: "Owner", producer: "Producer", editor: "Editor" } as const;

/** The channel's deal templates: each item is a number of days before publish or after go-live. */
export function TemplatesSection({ channelId, canEdit }: { channelId: string; canEdit: boolean }) {
  const templates = useTemplates(channelId);
  const remove = useDeleteTemplate(channelId);
  const [editing, setEditing] = useState<DealTemplate | "new" | null>(null);
  return (
    <section aria-labelledby="templates-heading" className="mt-10">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="templates-heading" className="text-lg font-semibold">
          Deal templates
        </h2>
        {canEdit && editing === null && <Button onClick={() => setEditing("new")}>New template</Button>}
      </div>
      {editing !== null && <TemplateForm channelId={channelId} template={editing === "new" ? null : editing} onDone={() => setEditing(null)} />}
      <QueryState
        query={templates}
        loading="Loading templates…"
        isEmpty={(list) => list.length === 0}
        empty={editing === null && <Empty title="No templates yet">{canEdit ? "A template lists a deal's items and when each is due; a new deal copies them." : "A producer sets them up."}</Empty>}
      >
        {(list) => (
          <ul className="mt-3 grid gap-3 md:grid-cols-2">
            {list.map((t) => (
              <li key={t.id} className="rounded-lg border border-ply-300 bg-white p-4">
                <div className="mb-2 flex items-baseline justify-between gap-2">
                  <h3 className="font-semibold">{t.name}</h3>
                  {canEdit && (
                    <span className="flex gap-1">
                      <Button tone="quiet" className="px-2 py-1" onClick={() => setEditing(t)}>
                        Edit
                      </Button>
                      <Button
                        tone="danger"
                        className="px-2 py-1"
                        onClick={() => {
                          if (window.confirm(`Delete the template "${t.name}"? Deals made from it keep their items.`)) remove.mutate(t.id);
                        }}
                      >
                        Delete
                      </Button>
                    </span>
                  )}
                </div>
                <ol className="flex flex-col gap-0.5 text-sm">
                  {t.items.map((item, i) => (
                    <li key={i} className="flex justify-between gap-3">
                      <span>
                        {item.title}
                        {item.approves != null && t.items[item.approves] && <span className="block text-xs text-graphite-500">Approves: {t.items[item.approves]!.title}</span>}
                      </span>
                      <span className="whitespace-nowrap text-graphite-500">
                        {describeDating(item.anchor, item.offsetDays)}
                      </span>
                    </li>
                  ))}
                </ol>
              </li>
            ))}
          </ul>
        )}
      </QueryState>
    </section>
  );
}

interface ItemValues {
  kind: string;
  title: string;
  anchor: string;
  offsetDays: string;
  ownerRole: string;
  /** The position of the item this one approves, or "" for none. */
  approves: string;
}
interface TemplateValues {
  name: string;
  items: ItemValues[];
}

const toValues = (items: DealTemplate["items"]): ItemValues[] =>
  items.map((i) => ({ kind: i.kind, title: i.title, anchor: i.anchor, offsetDays: String(i.offsetDays), ownerRole: i.ownerRole ?? "", approves: i.approves == null ? "" : String(i.approves) }));

/** The rows left when one is removed, with each pairing still naming the same item (or none, if it was the one removed). */
function withoutRow(values: ItemValues[], removed: number): ItemValues[] {
  return values
    .filter((_, index) => index !== removed)
    .map((item) => {
      if (item.approves === "") return item;
      const target = Number(item.approves);
      if (target === removed) return { ...item, approves: "" };
      return target > removed ? { ...item, approves: String(target - 1) } : item;
    });
}

function TemplateForm({ channelId, template, onDone }: { channelId: string; template: DealTemplate | null; onDone: () => void }) {
  const save = useSaveTemplate(channelId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<TemplateValues, unknown, ReturnType<typeof templateInputSchema.parse>>({
    resolver: schemaResolver(templateInputSchema, (v: TemplateValues) => ({
      name: v.name,
      items: v.items.map((i) => ({ kind: i.kind, title: i.title, anchor: i.anchor, offsetDays: numberFrom(i.offsetDays), ownerRole: i.ownerRole || null, approves: i.approves === "" ? null : Number(i.approves) })),
    })),
    defaultValues: { name: template?.name ?? "", items: toValues(template?.items ?? suggestedTemplateItems) },
  });
  const record = useOpenedRecord<DealTemplate>(template, (current) => form.reset({ name: current.name, items: toValues(current.items) }));
  const items = useFieldArray({ control: form.control, name: "items" });
  const titles = useWatch({ control: form.control, name: "items" }).map((item, index) => item.title.trim() || `Item ${index + 1}`);
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (input) => {
    setFormError(null);
    try {
      await save.mutateAsync({ id: template?.id ?? null, input, version: record.version });
      onDone();
    } catch (error) {
      setFormError(record.conflictIn(error) ?? applyServerErrors(error, form.setError, ["name"]));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label={template ? `Edit template ${template.name}` : "New template"} className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4">
      {formError && <Notice kind="error">{formError}</Notice>}
      {!template && <p className="text-sm text-graphite-500">Starts from Kerf's suggested outline (a workable default, not a published standard): change the days to match your contracts.</p>}
      <div className="max-w-sm">
        <TextField label="Template name" {...form.register("name")} error={errors.name?.message} />
      </div>
      {errorAt(errors, "items") && <p className="text-sm text-alarm-600">{errorAt(errors, "items")}</p>}
      <ol className="flex flex-col gap-2">
        {items.fields.map((field, index) => (
          <li key={field.id} className="grid items-start gap-2 rounded-md border border-ply-200 p-2 sm:grid-cols-[10rem_1fr_5rem_11rem_10rem_auto] lg:grid-cols-[10rem_1fr_5rem_11rem_10rem_12rem_auto]">
            <select aria-label={`Kind of item ${index + 1}`} className="rounded-md border border-ply-300 bg-white px-2 py-2" {...form.register(`items.${index}.kind`)}>
              {deliverableKinds.map((k) => (
                <option key={k} value={k}>
                  {deliverableKindLabels[k]}
                </option>
              ))}
            </select>
            <div>
              <input aria-label={`Item ${index + 1}`} className="w-full rounded-md border border-ply-300 px-2 py-2" {...form.register(`items.${index}.title`)} />
              {errorAt(errors, `items.${index}.title`) && <p className="text-xs text-alarm-600">{errorAt(errors, `items.${index}.title`)}</p>}
            </div>
            <div>
              <input aria-label={`Days for item ${index + 1}`} inputMode="numeric" className="w-full rounded-md border border-ply-300 px-2 py-2" {...form.register(`items.${index}.offsetDays`)} />
              {errorAt(errors, `items.${index}.offsetDays`) && <p className="text-xs text-alarm-600">{errorAt(errors, `items.${index}.offsetDays`)}</p>}
            </div>
            <select aria-label={`Counted from, item ${index + 1}`} className="rounded-md border border-ply-300 bg-white px-2 py-2" {...form.register(`items.${index}.anchor`)}>
              {templateAnchors.map((a) => (
                <option key={a} value={a}>
                  {anchorLabels[a]}
                </option>
              ))}
            </select>
            <select aria-label={`Usual owner, item ${index + 1}`} className="rounded-md border border-ply-300 bg-white px-2 py-2" {...form.register(`items.${index}.ownerRole`)}>
              {Object.entries(ownerRoleLabels).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </select>
            <div className="sm:col-span-5 lg:col-span-1">
              <select aria-label={`Approval of, item ${index + 1}`} className="w-full rounded-md border border-ply-300 bg-white px-2 py-2" {...form.register(`items.${index}.approves`)}>
                <option value="">Approves: none</option>
                {titles.map((title, other) =>
                  other === index ? null : (
                    <option key={other} value={String(other)}>
                      Approves: {title}
                    </option>
                  ),
                )}
              </select>
              {errorAt(errors, `items.${index}.approves`) && <p className="text-xs text-alarm-600">{errorAt(errors, `items.${index}.approves`)}</p>}
            </div>
            <Button type="button" tone="quiet" className="px-2" aria-label={`Remove item ${index + 1}`} onClick={() => items.replace(withoutRow(form.getValues("items"), index))}>
              ✕
            </Button>
          </li>
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <Button type="button" tone="quiet" onClick={() => items.append({ kind: "other", title: "", anchor: "before_publish", offsetDays: "7", ownerRole: "", approves: "" })}>
          Add a row
        </Button>
        <Button type="submit" busy={save.isPending}>
          Save template
        </Button>
        <Button type="button" tone="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
