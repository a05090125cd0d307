import type { ComponentProps } from "react";

type Tone = "primary" | "quiet" | "danger";

const tones: Record<Tone, string> = {
  primary: "bg-rust-600 text-white hover:bg-rust-700 disabled:bg-graphite-500",
  quiet: "bg-ply-50 text-graphite-900 border border-ply-300 hover:bg-ply-200",
  danger: "bg-ply-50 text-alarm-600 border border-alarm-600/40 hover:bg-alarm-600 hover:text-white",
};

export function Button({ tone = "primary", busy = false, className = "", children, disabled, ...rest }: ComponentProps<"button"> & { tone?: Tone; busy?: boolean }) {
  return (
    <button
      {...rest}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-70 ${tones[tone]} ${className}`}
    >
      {busy && <span className="size-3 animate-spin rounded-full border-2 border-current border-t-transparent" aria-hidden />}
      {children}
    </button>
  );
}
