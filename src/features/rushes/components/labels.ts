import type { ClipView } from "@shared/rushes/schemas";
import { describeFormat } from "@shared/timecode/rates";

/** A clip's timecode format in words: "29.97 fps drop-frame". */
export const clipFormatText = (clip: Pick<ClipView, "frameRate" | "dropFrame">) => (clip.frameRate ? describeFormat({ rate: clip.frameRate, dropFrame: clip.dropFrame }) : "No frame rate");
