import { z } from "zod";
import { type TimecodeFormat, timecodeFormatSchema } from "./rates";
import { checkTimecode } from "./timecode";

/** A timecode label checked against a format known up front (e.g. the clip's, loaded on the server). */
export function timecodeAt(format: TimecodeFormat) {
  return z.string().superRefine((label, ctx) => {
    const check = checkTimecode(label, format);
    if (!check.ok) ctx.addIssue({ code: "custom", message: check.message });
  });
}

/**
 * For a body whose format travels beside the label: call from the object's superRefine, e.g.
 * `.superRefine((body, ctx) => addTimecodeIssue(ctx, body.startTimecode, body.format, ["startTimecode"]))`.
 */
export function addTimecodeIssue(
  ctx: z.RefinementCtx,
  label: string,
  format: TimecodeFormat,
  path: (string | number)[],
): void {
  const check = checkTimecode(label, format);
  if (!check.ok) ctx.addIssue({ code: "custom", path, message: check.message });
}

/** An in/out mark at a known format: both labels valid and the out point after the in point. */
export function markRangeAt(format: TimecodeFormat) {
  return z
    .object({ in: z.string(), out: z.string() })
    .superRefine((mark, ctx) => {
      const first = checkTimecode(mark.in, format);
      const end = checkTimecode(mark.out, format);
      if (!first.ok) ctx.addIssue({ code: "custom", path: ["in"], message: first.message });
      if (!end.ok) ctx.addIssue({ code: "custom", path: ["out"], message: end.message });
      if (first.ok && end.ok && end.frame <= first.frame) {
        const message = `The out point ${mark.out} must come after the in point ${mark.in}`;
        ctx.addIssue({ code: "custom", path: ["out"], message });
      }
    });
}

/** A label together with its format, as a clip's start timecode arrives from media probing. */
export const timecodeWithFormatSchema = z
  .object({ timecode: z.string(), format: timecodeFormatSchema })
  .superRefine((body, ctx) => addTimecodeIssue(ctx, body.timecode, body.format, ["timecode"]));
