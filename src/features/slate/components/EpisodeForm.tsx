import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState, type KeyboardEvent } from "react";
import { Controller, useForm, useWatch, type FieldErrors } from "react-hook-form";
import { commonCurrencies, episodeFieldsSchema, originLabels, origins, tagSchema, type EpisodeFields } from "@shared/slate/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { isConflict } from "../api/episode-mutation";
import { usePeople } from "../api/get-people";
import { SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";

const fieldNames = ["title", "question", "origin", "originLink", "whyWorthIt", "ownerId", "tags", "budgetAmount", "budgetCurrency", "targetPublishDate"] as const;

/** The episode's fields, for a new episode and for an edit; the server's per-field messages land on the fields. */
export function EpisodeForm({
  channelId,
  initial,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  channelId: string;
  initial: EpisodeFields;
  submitLabel: string;
  onSubmit: (fields: EpisodeFields) => Promise<void>;
  onCancel: () => void;
}) {
  const people = usePeople(channelId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<EpisodeFields>({ resolver: zodResolver(episodeFieldsSchema), defaultValues: initial });
  const origin = useWatch({ control: form.control, name: "origin" });
  const errors = form.formState.errors;

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (error) {
      if (isConflict(error)) {
        setFormError("Someone else saved this episode while you were editing; the page behind this form shows their version. Your changes are still here: save again to put them over theirs.");
      } else {
        setFormError(applyServerErrors(error, form.setError, [...fieldNames]));
      }
    }
  });

  const ownerOptions = [{ value: "", label: "No owner yet" }, ...(people.data ?? []).map((p) => ({ value: p.id, label: p.name }))];
  const currencyOptions = [{ value: "", label: "—" }, ...commonCurrencies.map((c) => ({ value: c, label: c }))];
  const initialCurrency = initial.budgetCurrency;
  if (initialCurrency && !commonCurrencies.includes(initialCurrency as (typeof commonCurrencies)[number])) currencyOptions.push({ value: initialCurrency, label: initialCurrency });

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <TextField label="Working title" autoFocus {...form.register("title")} error={errors.title?.message} />
      </div>
      <div className="sm:col-span-2">
        <TextField label="The question, in one line" hint="What will the video find out? e.g. “Can two leaf blowers carry a rider?”" {...form.register("question")} error={errors.question?.message} />
      </div>
      <SelectField label="Where it came from" options={origins.map((o) => ({ value: o, label: originLabels[o] }))} {...form.register("origin")} error={errors.origin?.message} />
      <TextField
        label={origin === "viewer" ? "Link to the suggestion" : "Link (optional)"}
        type="url"
        inputMode="url"
        placeholder="https://"
        {...form.register("originLink")}
        error={errors.originLink?.message}
      />
      <div className="sm:col-span-2">
        <TextAreaField label="Why it is worth a video" {...form.register("whyWorthIt")} error={errors.whyWorthIt?.message} />
      </div>
      <SelectField label="Owner" options={ownerOptions} {...form.register("ownerId")} error={errors.ownerId?.message} />
      <TextField label="Target publish date" type="date" {...form.register("targetPublishDate")} error={errors.targetPublishDate?.message} />
      <div className="grid grid-cols-[1fr_7rem] gap-2">
        <TextField label="Rough budget" inputMode="decimal" placeholder="e.g. 250" {...form.register("budgetAmount")} error={errors.budgetAmount?.message} />
        <SelectField label="Currency" options={currencyOptions} {...form.register("budgetCurrency")} error={errors.budgetCurrency?.message} />
      </div>
      <Controller control={form.control} name="tags" render={({ field }) => <TagsField value={field.value} onChange={field.onChange} error={tagsError(errors)} />} />
      {formError && (
        <div className="sm:col-span-2">
          <Notice kind="error">{formError}</Notice>
        </div>
      )}
      <div className="flex justify-end gap-2 sm:col-span-2">
        <Button type="button" tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" busy={form.formState.isSubmitting}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}

function tagsError(errors: FieldErrors<EpisodeFields>): string | undefined {
  const tags = errors.tags;
  if (!tags) return undefined;
  if (tags.message) return tags.message;
  const first = Array.isArray(tags) ? tags.find(Boolean) : undefined;
  return first?.message ?? (tags.root?.message as string | undefined);
}

/** Tags as chips: type a word and press Enter or a comma; Backspace in an empty box removes the last. */
function TagsField({ value, onChange, error }: { value: string[]; onChange: (tags: string[]) => void; error?: string }) {
  const id = useId();
  const [draft, setDraft] = useState("");
  const [draftError, setDraftError] = useState<string | null>(null);
  const add = () => {
    const parsed = tagSchema.safeParse(draft);
    if (!draft.trim()) return;
    if (!parsed.success) return setDraftError(parsed.error.issues[0]?.message ?? "That tag won't do.");
    if (!value.includes(parsed.data)) onChange([...value, parsed.data]);
    setDraft("");
    setDraftError(null);
  };
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === "Enter" || event.key === ",") {
      event.preventDefault();
      add();
    } else if (event.key === "Backspace" && draft === "" && value.length > 0) {
      onChange(value.slice(0, -1));
    }
  };
  const message = draftError ?? error;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        Tags
      </label>
      <div className={`flex flex-wrap items-center gap-1 rounded-md border bg-white px-2 py-1.5 shadow-inner ${message ? "border-alarm-600" : "border-ply-300"}`}>
        {value.map((tag) => (
          <span key={tag} className="inline-flex items-center gap-1 rounded bg-ply-200 px-2 py-0.5 text-sm">
            {tag}
            <button type="button" className="text-graphite-500 hover:text-alarm-600" aria-label={`Remove tag ${tag}`} onClick={() => onChange(value.filter((t) => t !== tag))}>
              ×
            </button>
          </span>
        ))}
        <input
          id={id}
          value={draft}
          onChange={(event) => setDraft(event.target.value)}
          onKeyDown={onKeyDown}
          onBlur={add}
          aria-invalid={message ? true : undefined}
          aria-describedby={`${id}-hint`}
          className="min-w-24 flex-1 border-0 bg-transparent px-1 py-0.5 text-base outline-none"
          placeholder={value.length === 0 ? "e.g. flying" : ""}
        />
      </div>
      {message ? (
        <p id={`${id}-hint`} className="text-sm text-alarm-600">
          {message}
        </p>
      ) : (
        <p id={`${id}-hint`} className="text-xs text-graphite-500">
          Press Enter or a comma after each tag.
        </p>
      )}
    </div>
  );
}
