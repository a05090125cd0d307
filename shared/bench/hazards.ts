/**
 * The hazards Kerf offers on a test plan's safety list. The cautions are the usual ones found in
 * makers' and retailers' guides (common practice, not a standard text); each defers to the
 * manufacturer's ratings, local codes and licensed practice, which always govern.
 */
export const hazardKinds = [
  "lipo_overcharge",
  "lipo_overdischarge",
  "lipo_puncture",
  "lipo_unattended_charging",
  "over_voltage",
  "spinning_blades",
  "heat",
  "mains",
  "flying",
] as const;
export type HazardKind = (typeof hazardKinds)[number];

/** A hazard typed in by the host rather than picked from the list. */
export const CUSTOM_HAZARD = "custom";
export type HazardChoice = HazardKind | typeof CUSTOM_HAZARD;

export interface HazardEntry {
  label: string;
  /** What can go wrong and the usual precautions, shown beside the hazard. */
  caution: string;
  /**
   * A starting point for the mitigation field; the host rewrites it for the build. Figures in it
   * (such as stopping at 3.5 V a cell at rest) are common practice from hobby guides, not a standard.
   */
  suggestedMitigation: string;
}

export const hazardCatalogue: Record<HazardKind, HazardEntry> = {
  lipo_overcharge: {
    label: "Lithium cells: over-charge",
    caution:
      "A lithium cell charged past its full voltage (about 4.2 V a cell for common LiPo cells) can swell, vent and burn. " +
      "Charge only with a charger set to the pack's chemistry and cell count, balance lead connected.",
    suggestedMitigation: "Balance charger set to LiPo and the pack's cell count, checked before every charge.",
  },
  lipo_overdischarge: {
    label: "Lithium cells: over-discharge",
    caution:
      "Running a pack below about 3.0 V a cell damages it and can leave it unsafe to charge again. " +
      "Use a low-voltage cut-off and retire packs that were run flat, following the maker's guidance.",
    suggestedMitigation: "Low-voltage cut-off set on the controller; runs stop when the pack reads 3.5 V a cell at rest.",
  },
  lipo_puncture: {
    label: "Lithium cells: puncture or crushing",
    caution:
      "A punctured, crushed or swollen pack can burn fiercely and re-ignite. Keep packs where a crash or a tool cannot reach " +
      "them, inspect them before use, and keep a fire-safe bag or a bucket of sand at hand.",
    suggestedMitigation: "Pack strapped inside the frame away from blades; inspected for swelling before each run.",
  },
  lipo_unattended_charging: {
    label: "Lithium cells: fire when charging unattended",
    caution:
      "Pack fires most often start on the charger. Never charge unattended or overnight; charge on a fire-safe surface, " +
      "away from anything that burns, with a smoke alarm in the room.",
    suggestedMitigation: "Charging only on the steel tray in the workshop, someone present for the whole charge.",
  },
  over_voltage: {
    label: "Over-voltage on motors and fans",
    caution:
      "A motor, fan or speed controller run above its rated voltage can overheat, lose its magnets or fail suddenly, and " +
      "a failing part can take the pack with it. Keep to the manufacturer's ratings.",
    suggestedMitigation: "Supply checked against every part's rated voltage before power-on; runs above a rating are noted on the run.",
  },
  spinning_blades: {
    label: "Spinning blades and propellers",
    caution:
      "A propeller or fan blade can cut deeply and throw fragments. Clamp the test stand, stay out of the blade's plane, " +
      "wear eye protection and connect the pack last.",
    suggestedMitigation: "Stand clamped to the bench, guard ring fitted, everyone behind the line and wearing safety glasses.",
  },
  heat: {
    label: "Heat and hot-melt",
    caution:
      "Motors, controllers, soldering irons and hot-melt glue get hot enough to burn skin and start fires. " +
      "Let parts cool before handling and keep a clear, non-flammable work area.",
    suggestedMitigation: "Parts left to cool before handling; glue gun and iron on their stands, switched off after use.",
  },
  mains: {
    label: "Mains power",
    caution:
      "Mains voltage can kill. Use rated, enclosed power supplies; only a qualified person works on mains wiring, " +
      "following the local electrical code.",
    suggestedMitigation: "Only the enclosed bench supply touches mains, on a residual-current protected socket.",
  },
  flying: {
    label: "Flying near people or above the local height limit",
    caution:
      "Flying rules (registration, height limits, distance from people and buildings) differ by country and change. " +
      "Check your national aviation authority's current rules before any flight.",
    suggestedMitigation: "Tethered flights indoors only; outdoor flights in an open field, below the local height limit, nobody underneath.",
  },
};

/** Shown on every safety list. */
export const SAFETY_NOTE =
  "These are the usual cautions, not a full safety assessment. Local codes, manufacturer ratings and licensed practice govern.";

/** Shown whenever a plan involves flying. */
export const FLYING_NOTE =
  "Flying rules differ by country and change over time. Check your national aviation authority; nothing in Kerf is legal advice.";

export function hazardLabel(kind: string, title: string | null): string {
  if (kind === CUSTOM_HAZARD) return title ?? "Other hazard";
  return hazardCatalogue[kind as HazardKind]?.label ?? title ?? kind;
}

export function isCatalogueHazard(kind: string): kind is HazardKind {
  return (hazardKinds as readonly string[]).includes(kind);
}
