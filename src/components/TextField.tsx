import { useId, type InputHTMLAttributes, type Ref } from "react";

export function TextField({ label, error, hint, ref, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string; ref?: Ref<HTMLInputElement> }) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        {label}
      </label>
      <input
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`rounded-md border bg-white px-3 py-2 text-base shadow-inner ${error ? "border-alarm-600" : "border-ply-300"}`}
        {...input}
      />
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-graphite-500">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-sm text-alarm-600">
          {error}
        </p>
      )}
    </div>
  );
}
