import type { ReactNode } from "react";
import { Button } from "./Button";

export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 p-8 text-graphite-500">
      <span className="size-4 animate-spin rounded-full border-2 border-rust-600 border-t-transparent" aria-hidden />
      {label}
    </div>
  );
}

export function LoadError({ error, retry }: { error: unknown; retry?: () => void }) {
  const message = error instanceof Error ? error.message : "Something went wrong.";
  return (
    <div role="alert" className="m-4 flex flex-col items-start gap-3 rounded-lg border border-alarm-600/30 bg-white p-6">
      <p className="font-semibold text-alarm-600">This didn't load.</p>
      <p className="text-sm text-graphite-700">{message}</p>
      {retry && (
        <Button tone="quiet" onClick={retry}>
          Try again
        </Button>
      )}
    </div>
  );
}

export function Empty({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-lg border border-dashed border-ply-300 p-8 text-center">
      <p className="font-semibold text-graphite-700">{title}</p>
      {children && <div className="text-sm text-graphite-500">{children}</div>}
    </div>
  );
}
