import { type ExportClip, formatOf, sourceRanges } from "./clip-ranges";
import { mediaUrl } from "./media-names";

/**
 * OpenTimelineIO's JSON form (schema names and fields as OpenTimelineIO's headers and
 * docs/tutorials/otio-serialized-schema-only-fields.md define them): a Timeline.1 holding a Stack.1
 * of one Video Track.1, each mark a Clip.2 whose source_range is the mark (in its clip's own rate),
 * pointing at its file through an ExternalReference.1. target_url is the file's name as a relative,
 * percent-encoded URL (media-names.ts): the name the file has in Kerf's zip, so an editing program
 * that opens the timeline beside the unzipped files finds every one.
 */
// Hand-written: OpenTimelineIO has no JavaScript library; its JSON is a few plain objects.
type RationalTime = { OTIO_SCHEMA: "RationalTime.1"; value: number; rate: number };
type TimeRange = { OTIO_SCHEMA: "TimeRange.1"; start_time: RationalTime; duration: RationalTime };

const rt = (value: number, rate: number): RationalTime => ({ OTIO_SCHEMA: "RationalTime.1", value, rate });
const range = (start: number, duration: number, rate: number): TimeRange => ({ OTIO_SCHEMA: "TimeRange.1", start_time: rt(start, rate), duration: rt(duration, rate) });

/** The Clip.2 objects of one clip: one per mark, or the whole clip; none without a frame rate. */
export function otioClips(clip: ExportClip, name: string): object[] {
  const format = formatOf(clip);
  if (!format) return [];
  const rate = format.rate.numerator / format.rate.denominator;
  const whole = sourceRanges({ ...clip, marks: [] }, format)[0]!;
  return sourceRanges(clip, format).map((r, index) => ({
    OTIO_SCHEMA: "Clip.2",
    metadata: { kerf: { clip_id: clip.id, object_key: clip.objectKey, note: r.note, rating: clip.rating, tags: clip.tags, drop_frame: clip.dropFrame } },
    name: clip.marks.length > 1 ? `${name} #${index + 1}` : name,
    source_range: range(r.start, r.end - r.start, rate),
    effects: [],
    markers: [],
    enabled: true,
    media_references: {
      DEFAULT_MEDIA: {
        OTIO_SCHEMA: "ExternalReference.1",
        metadata: {},
        name,
        available_range: range(whole.start, whole.end - whole.start, rate),
        available_image_bounds: null,
        target_url: mediaUrl(name),
      },
    },
    active_media_reference_key: "DEFAULT_MEDIA",
  }));
}

const slot = "\u0000kerf-clips\u0000";

/**
 * The timeline in pieces, so a long one can be sent as its clips are read: `head`, then `clips(...)` for
 * each batch (in order), then `tail`. Together they are one JSON document.
 */
export function otioWriter(title: string) {
  const timeline = {
    OTIO_SCHEMA: "Timeline.1",
    metadata: { kerf: { exported_at: new Date().toISOString() } },
    name: title,
    global_start_time: null,
    tracks: {
      OTIO_SCHEMA: "Stack.1",
      metadata: {},
      name: "tracks",
      source_range: null,
      effects: [],
      markers: [],
      enabled: true,
      children: [{ OTIO_SCHEMA: "Track.1", metadata: {}, name: "Footage", source_range: null, effects: [], markers: [], enabled: true, children: [slot], kind: "Video" }],
    },
  };
  const [head, tail] = JSON.stringify(timeline).split(JSON.stringify(slot)) as [string, string];
  let first = true;
  return {
    head,
    clips(clips: readonly ExportClip[], names: Map<string, string>): string {
      let out = "";
      for (const clip of clips) {
        for (const item of otioClips(clip, names.get(clip.id) ?? clip.fileName)) {
          out += (first ? "" : ",") + JSON.stringify(item);
          first = false;
        }
      }
      return out;
    },
    tail: `${tail}\n`,
  };
}

export function footageOtio(title: string, clips: readonly ExportClip[], names: Map<string, string>): string {
  const writer = otioWriter(title);
  return writer.head + writer.clips(clips, names) + writer.tail;
}
