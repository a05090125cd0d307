/**
 * People's text on one line of a list file. Every control character (Unicode category Cc: C0, DEL and C1,
 * so CR, LF, VT, FF, the separators U+001C–U+001E and NEL U+0085) and the line and paragraph separators
 * (Zl U+2028, Zp U+2029) become one space. Those are every character that ends a line for some reader:
 * Unicode Standard Annex #14 (Unicode Line Breaking Algorithm), classes BK, CR, LF and NL; and Python's
 * `str.splitlines` (Python documentation, "Built-in Types", str.splitlines), which OpenTimelineIO's CMX 3600
 * reader uses to cut a list into lines (OpenTimelineIO/otio-cmx3600-adapter, src/otio_cmx3600_adapter/edl_parser.py).
 */
export function oneLine(text: string): string {
  return text.replace(/[\p{Cc}\p{Zl}\p{Zp}\s]+/gu, " ").trim();
}

/** True when the text holds nothing that any of those readers would take as the end of a line. */
export function isOneLine(text: string): boolean {
  return !/[\p{Cc}\p{Zl}\p{Zp}]/u.test(text);
}
