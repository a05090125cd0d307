import type { ClipMetadata } from "@shared/rushes/schemas";
import { clipMetadataSchema } from "@shared/rushes/schemas";
import { metadataFromProbe, type ProbeTrack } from "@shared/rushes/media";
import wasmUrl from "mediainfo.js/MediaInfoModule.wasm?url";

import type { MediaInfo as MediaInfoOf } from "mediainfo.js";

type MediaInfo = MediaInfoOf<"object">;
let instance: Promise<MediaInfo> | null = null;

/** mediainfo.js, loaded once and only when a file is chosen (its WebAssembly is about 2 MB). */
function mediaInfo(): Promise<MediaInfo> {
  instance ??= import("mediainfo.js").then(({ default: factory }) => factory({ format: "object", locateFile: () => wasmUrl }) as Promise<MediaInfo>);
  return instance;
}

let queue: Promise<unknown> = Promise.resolve();

/**
 * Reads a clip's metadata in slices (never the whole file); null when it can't be read. One file at a
 * time: a mediainfo instance reading two files at once mixes their answers.
 */
export function probeFile(file: File): Promise<ClipMetadata | null> {
  const turn = queue.then(() => probeOne(file));
  queue = turn.catch(() => undefined);
  return turn;
}

async function probeOne(file: File): Promise<ClipMetadata | null> {
  try {
    const mi = await mediaInfo();
    const result = (await mi.analyzeData(file.size, async (size: number, offset: number) => new Uint8Array(await file.slice(offset, offset + size).arrayBuffer()))) as unknown as {
      media?: { track?: ProbeTrack[] };
    };
    const metadata = metadataFromProbe(result.media?.track ?? []);
    const checked = clipMetadataSchema.safeParse(metadata);
    return checked.success ? checked.data : null;
  } catch {
    return null;
  }
}
