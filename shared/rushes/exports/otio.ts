import { type ExportClip, formatOf, sourceRanges } from "./clip-ranges";

/**
 * OpenTimelineIO's JSON form (schema names and fields as OpenTimelineIO's headers and
 * docs/tutorials/otio-serialized-schema-only-fields.md define them): a Timeline.1 holding a Stack.1
 * of one Video Track.1, each mark a Clip.2 whose source_range is the mark (in its clip's own rate),
 * pointing at its file through an ExternalReference.1. target_url is the file's name, so an editing
 * program relinks it to the downloaded files (the bulk zip holds them under the same names).
 */
// Hand-written: OpenTimelineIO has no JavaScript library; its JSON is a few plain objects.
type RationalTime = { OTIO_SCHEMA: "RationalTime.1"; value: number; rate: number };
type TimeRange = { OTIO_SCHEMA: "TimeRange.1"; start_time: RationalTime; duration: RationalTime };

const rt = (value: number, rate: number): RationalTime => ({ OTIO_SCHEMA: "RationalTime.1", value, rate });
const range = (start: number, duration: number, rate: number): TimeRange => ({ OTIO_SCHEMA: "TimeRange.1", start_time: rt(start, rate), duration: rt(duration, rate) });

export function footageOtio(title: string, clips: ExportClip[]): string {
  const children: object[] = [];
  for (const clip of clips) {
    const format = formatOf(clip);
    if (!format) continue;
    const rate = format.rate.numerator / format.rate.denominator;
    const whole = sourceRanges({ ...clip, marks: [] }, format)[0]!;
    for (const [index, r] of sourceRanges(clip, format).entries()) {
      children.push({
        OTIO_SCHEMA: "Clip.2",
        metadata: { kerf: { clip_id: clip.id, object_key: clip.objectKey, note: r.note, rating: clip.rating, tags: clip.tags, drop_frame: clip.dropFrame } },
        name: clip.marks.length > 1 ? `${clip.fileName} #${index + 1}` : clip.fileName,
        source_range: range(r.start, r.end - r.start, rate),
        effects: [],
        markers: [],
        enabled: true,
        media_references: {
          DEFAULT_MEDIA: {
            OTIO_SCHEMA: "ExternalReference.1",
            metadata: {},
            name: clip.fileName,
            available_range: range(whole.start, whole.end - whole.start, rate),
            available_image_bounds: null,
            target_url: clip.fileName,
          },
        },
        active_media_reference_key: "DEFAULT_MEDIA",
      });
    }
  }
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
      children: [{ OTIO_SCHEMA: "Track.1", metadata: {}, name: "Footage", source_range: null, effects: [], markers: [], enabled: true, children, kind: "Video" }],
    },
  };
  return JSON.stringify(timeline, null, 2) + "\n";
}
