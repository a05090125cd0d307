/**
 * Reel names of an edit decision list. CMX 3600 gives the source reel 8 characters (CMX Editing Systems,
 * "CMX 3600 Editing System" reference manual, EDL format chapter, from memory; restated by OpenTimelineIO's
 * CMX 3600 adapter, whose writer cuts reels to 8 characters by default and whose reader knows 8, 16 and 32
 * character "File 16/32" variants: OpenTimelineIO/otio-cmx3600-adapter, src/otio_cmx3600_adapter/edl_parser.py
 * and tests/test_cmx_3600_adapter.py, test_reelname_length). Letters, digits and underscores only, upper case
 * (common practice: what every reader takes).
 */
export const REEL_LENGTH = 8;

/** The reel a file's name would give on its own: its stem in capitals, underscores dropped if too long. */
export function reelName(fileName: string): string {
  const stem = fileName
    .replace(/\.[^.]*$/, "")
    .normalize("NFKD")
    .toUpperCase()
    .replace(/[^A-Z0-9_]/g, "");
  const fitted = stem.length > REEL_LENGTH ? stem.replace(/_/g, "") : stem;
  return (fitted || "CLIP").slice(0, REEL_LENGTH);
}

/**
 * One reel per clip, unique within the list: a reel already given to another clip ends in a number
 * instead ("BRIDGETE", then "BRIDGET2", … "BRIDGE10"), so two files never share a reel. In list order.
 */
export function uniqueReels(files: readonly { id: string; fileName: string }[]): Map<string, string> {
  const reels = new Map<string, string>();
  const used = new Set<string>();
  for (const file of files) {
    if (reels.has(file.id)) continue;
    const wanted = reelName(file.fileName);
    let reel = wanted;
    for (let n = 2; used.has(reel); n++) reel = wanted.slice(0, REEL_LENGTH - String(n).length) + String(n);
    used.add(reel);
    reels.set(file.id, reel);
  }
  return reels;
}
