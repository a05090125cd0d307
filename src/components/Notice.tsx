import type { ReactNode } from "react";

type Kind = "error" | "info" | "success";

const kinds: Record<Kind, string> = {
  error: "border-alarm-600/40 bg-alarm-600/5 text-alarm-600",
  info: "border-ply-300 bg-ply-50 text-graphite-700",
  success: "border-moss-600/40 bg-moss-600/5 text-moss-600",
};

export function Notice({ kind = "info", children }: { kind?: Kind; children: ReactNode }) {
  return (
    <div role={kind === "error" ? "alert" : "status"} className={`rounded-md border px-4 py-3 text-sm ${kinds[kind]}`}>
      {children}
    </div>
  );
}
