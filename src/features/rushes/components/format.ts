import type { ClipView } from "@shared/rushes/schemas";
import { describeFormat } from "@shared/timecode/rates";

export function formatDuration(ms: number): string {
  const total = Math.round(ms / 1000);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const pad = (n: number) => String(n).padStart(2, "0");
  return h > 0 ? `${h}:${pad(m)}:${pad(s)}` : `${m}:${pad(s)}`;
}

export const clipFormatText = (clip: Pick<ClipView, "frameRate" | "dropFrame">) => (clip.frameRate ? describeFormat({ rate: clip.frameRate, dropFrame: clip.dropFrame }) : "No frame rate");

export const formatWhen = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });
