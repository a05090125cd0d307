import type { CalendarKind } from "@shared/calendar/entries";

/**
 * Kerf's own marks for each kind: a left notch in the plywood palette and a short glyph, so a kind
 * reads without colour too (the glyph is hidden from screen readers, which hear the kind's name).
 */
export const kindMark: Record<CalendarKind, { edge: string; glyph: string }> = {
  publish: { edge: "border-l-rust-600", glyph: "▲" },
  release: { edge: "border-l-rust-700", glyph: "◆" },
  shoot: { edge: "border-l-moss-600", glyph: "●" },
  deliverable: { edge: "border-l-amber-cut", glyph: "■" },
  stage_due: { edge: "border-l-graphite-500", glyph: "│" },
  figures: { edge: "border-l-graphite-700", glyph: "≡" },
};
