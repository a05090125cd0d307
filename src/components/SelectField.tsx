import { useId, type Ref, type SelectHTMLAttributes } from "react";

export function SelectField({ label, error, options, ref, ...select }: SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string; options: { value: string; label: string }[]; ref?: Ref<HTMLSelectElement> }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        {label}
      </label>
      <select id={id} ref={ref} aria-invalid={error ? true : undefined} className="rounded-md border border-ply-300 bg-white px-3 py-2 text-base" {...select}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {error && <p className="text-sm text-alarm-600">{error}</p>}
    </div>
  );
}
