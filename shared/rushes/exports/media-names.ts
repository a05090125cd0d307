import { oneLine } from "./one-line";

export interface NamedFile {
  id: string;
  fileName: string;
}

/** A file's own name as a safe name in a folder: no folder part, no leading dots, no control characters. */
function baseName(fileName: string): string {
  return oneLine(fileName.split(/[\\/]/).pop()!).replace(/^\.+/, "") || "clip";
}

function numbered(base: string, n: number): string {
  const dot = base.lastIndexOf(".");
  return dot > 0 ? `${base.slice(0, dot)} (${n})${base.slice(dot)}` : `${base} (${n})`;
}

/** The timeline inside Kerf's zip, beside the files it points at. */
export const TIMELINE_NAME = "timeline.otio";

/**
 * The names the clips' files have in a download: their own names, made unique (ignoring case, as
 * Windows and macOS folders do) by " (2)", " (3)", … The result depends only on the set of clips, not
 * on their order, so the zip of a selection, the OpenTimelineIO file and the EDL's reel list of the same
 * clips name every file alike. The timeline's own name is never given to a clip.
 */
export function mediaFileNames(files: readonly NamedFile[]): Map<string, string> {
  const used = new Set([TIMELINE_NAME]);
  const groups = new Map<string, NamedFile[]>();
  for (const file of files) {
    const key = baseName(file.fileName).toLowerCase();
    groups.set(key, [...(groups.get(key) ?? []), file]);
  }
  const names = new Map<string, string>();
  // Each clip's own name first (the lowest id of a shared name keeps it), then the numbered ones.
  const ordered = [...groups.keys()].sort().map((key) => groups.get(key)!.sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)));
  for (const group of ordered) {
    const base = baseName(group[0]!.fileName);
    if (!used.has(base.toLowerCase())) {
      used.add(base.toLowerCase());
      names.set(group[0]!.id, base);
    }
  }
  for (const group of ordered) {
    for (const file of group) {
      if (names.has(file.id)) continue;
      const base = baseName(file.fileName);
      let n = 2;
      while (used.has(numbered(base, n).toLowerCase())) n++;
      used.add(numbered(base, n).toLowerCase());
      names.set(file.id, numbered(base, n));
    }
  }
  return names;
}

/**
 * A file name as a relative URL reference to the file beside the timeline (RFC 3986, section 4.2), its
 * characters percent-encoded (section 2.1) so a space, "#", "?", "%" or ":" stays part of the name.
 */
export function mediaUrl(name: string): string {
  return encodeURIComponent(name);
}
