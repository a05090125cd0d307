/**
 * Custom thumbnails, as the platform's help page "Add video thumbnails" (YouTube Help) asks for them:
 * 1280 × 720 recommended, at least 640 pixels wide, a 16:9 ratio, a JPG, GIF or PNG file under 2 MB.
 */
export const THUMBNAIL_RECOMMENDED = { width: 1280, height: 720 } as const;
export const THUMBNAIL_MIN_WIDTH = 640;
/** "2 MB" on the help page; read as 2 × 1024 × 1024 bytes, the larger of the two readings (from memory). */
export const THUMBNAIL_MAX_BYTES = 2 * 1024 * 1024;
export const thumbnailTypes: Record<string, string> = { jpg: "image/jpeg", jpeg: "image/jpeg", png: "image/png", gif: "image/gif" };
/** The sizes a viewer meets a thumbnail at in lists (common practice: the platform's small cards). */
export const thumbnailPreviewSizes = [
  { width: 168, height: 94 },
  { width: 360, height: 202 },
] as const;

/** How far from 16:9 a picture may be and still count as 16:9 (one pixel of rounding at 640 px wide). */
const RATIO_TOLERANCE = 0.01;

export interface ThumbnailFacts {
  width: number | null;
  height: number | null;
  sizeBytes: number;
  contentType: string;
}

/** Every rule the picture breaks, in plain words; empty when the platform would take it. */
export function thumbnailProblems(facts: ThumbnailFacts): string[] {
  const problems: string[] = [];
  if (!Object.values(thumbnailTypes).includes(facts.contentType)) problems.push("The platform takes JPG, GIF or PNG thumbnails.");
  if (facts.sizeBytes > THUMBNAIL_MAX_BYTES) problems.push(`The file is ${(facts.sizeBytes / 1024 / 1024).toFixed(1)} MB; the platform takes thumbnails under 2 MB.`);
  if (facts.width === null || facts.height === null) return [...problems, "Kerf could not read the picture's size."];
  if (facts.width < THUMBNAIL_MIN_WIDTH) problems.push(`The picture is ${facts.width} px wide; the platform needs at least ${THUMBNAIL_MIN_WIDTH} (1280 × 720 is best).`);
  if (Math.abs(facts.width / facts.height - 16 / 9) > RATIO_TOLERANCE) problems.push(`The picture is ${facts.width} × ${facts.height}, not 16:9 (1280 × 720 is best).`);
  return problems;
}

/** A note, not a problem: smaller than the recommended size but still taken. */
export const belowRecommended = (facts: ThumbnailFacts) =>
  facts.width !== null && facts.width >= THUMBNAIL_MIN_WIDTH && facts.width < THUMBNAIL_RECOMMENDED.width;

/** What Kerf takes as a thumbnail upload: the platform's formats, up to a size that still lets the 2 MB rule be shown. */
export const THUMBNAIL_UPLOAD_MAX_BYTES = 10 * 1024 * 1024;

export type ThumbnailFileCheck = { ok: true; contentType: string } | { ok: false; status: 413 | 415 | 400; message: string };

export function checkThumbnailFile(fileName: string, size: number): ThumbnailFileCheck {
  const dot = fileName.lastIndexOf(".");
  const contentType = dot < 0 ? undefined : thumbnailTypes[fileName.slice(dot + 1).toLowerCase()];
  if (!contentType) return { ok: false, status: 415, message: "A thumbnail is a .jpg, .jpeg, .png or .gif file, as the platform takes them." };
  if (!Number.isSafeInteger(size) || size <= 0) return { ok: false, status: 400, message: `"${fileName}" is empty.` };
  if (size > THUMBNAIL_UPLOAD_MAX_BYTES) return { ok: false, status: 413, message: `"${fileName}" is over 10 MB; the platform takes thumbnails under 2 MB.` };
  return { ok: true, contentType };
}
