/**
 * Chapters as the video platform reads them from a description: one line per chapter, a timestamp
 * ("0:00", "4:05", "1:02:03") then the title. Its help page "Video chapters" (YouTube Help) gives the
 * rules: the first timestamp is 0:00, there are at least three, they go up, and each chapter lasts at
 * least 10 seconds.
 */
export interface Chapter {
  startSeconds: number;
  title: string;
}

export const MIN_CHAPTERS = 3;
export const MIN_CHAPTER_SECONDS = 10;

const lineShape = /^\s*(?:(\d+):)?(\d{1,2}):(\d{2})\s+(.+?)\s*$/;

/** "0:00", "12:05", "1:02:03": hours only when needed, minutes unpadded below an hour. */
export function formatChapterTime(totalSeconds: number): string {
  const whole = Math.floor(totalSeconds);
  const hours = Math.floor(whole / 3600);
  const minutes = Math.floor((whole % 3600) / 60);
  const seconds = String(whole % 60).padStart(2, "0");
  return hours > 0 ? `${hours}:${String(minutes).padStart(2, "0")}:${seconds}` : `${minutes}:${seconds}`;
}

export const formatChapters = (chapters: readonly Chapter[]) => chapters.map((c) => `${formatChapterTime(c.startSeconds)} ${c.title}`).join("\n");

export interface ParsedChapters {
  chapters: Chapter[];
  /** Lines that are not "time title", with their line numbers. */
  unreadable: { line: number; text: string }[];
}

/** Reads typed chapter lines; blank lines are skipped, others that don't fit are reported. */
export function parseChapters(text: string): ParsedChapters {
  const chapters: Chapter[] = [];
  const unreadable: ParsedChapters["unreadable"] = [];
  text.split(/\r?\n/).forEach((raw, index) => {
    if (raw.trim() === "") return;
    const match = lineShape.exec(raw);
    const [, h, m, s, title] = match ?? [];
    if (!match || Number(s) > 59 || (h !== undefined && Number(m) > 59) || !title) {
      unreadable.push({ line: index + 1, text: raw.trim() });
      return;
    }
    chapters.push({ startSeconds: Number(h ?? 0) * 3600 + Number(m) * 60 + Number(s), title });
  });
  return { chapters, unreadable };
}

/** One message per broken rule (never one per chapter), in the order the help page lists them. */
export function chapterProblems(chapters: readonly Chapter[], unreadable: ParsedChapters["unreadable"] = []): string[] {
  const problems: string[] = [];
  if (unreadable.length > 0) {
    problems.push(`Line${unreadable.length > 1 ? "s" : ""} ${unreadable.map((u) => u.line).join(", ")} ${unreadable.length > 1 ? "are" : "is"} not "0:00 Title".`);
  }
  if (chapters.length === 0) return [...problems, `There are no chapters yet: the platform needs at least ${MIN_CHAPTERS}, the first at 0:00.`];
  if (chapters[0]?.startSeconds !== 0) problems.push(`The first chapter must start at 0:00; it starts at ${formatChapterTime(chapters[0]?.startSeconds ?? 0)}.`);
  if (chapters.length < MIN_CHAPTERS) problems.push(`The platform needs at least ${MIN_CHAPTERS} chapters; there ${chapters.length === 1 ? "is 1" : `are ${chapters.length}`}.`);
  const pairs = chapters.slice(1).map((chapter, i) => [chapters[i] as Chapter, chapter] as const);
  const outOfOrder = pairs.filter(([a, b]) => b.startSeconds <= a.startSeconds);
  if (outOfOrder.length > 0) problems.push(`Chapters must go up in time: ${outOfOrder.map(([a, b]) => `${formatChapterTime(b.startSeconds)} comes after ${formatChapterTime(a.startSeconds)}`).join("; ")}.`);
  const short = pairs.filter(([a, b]) => b.startSeconds > a.startSeconds && b.startSeconds - a.startSeconds < MIN_CHAPTER_SECONDS);
  if (short.length > 0) {
    problems.push(`Each chapter must last at least ${MIN_CHAPTER_SECONDS} seconds: ${short.map(([a, b]) => `"${a.title}" lasts ${b.startSeconds - a.startSeconds} s`).join("; ")}.`);
  }
  return problems;
}

export function checkChapterText(text: string): { chapters: Chapter[]; problems: string[] } {
  const parsed = parseChapters(text);
  return { chapters: parsed.chapters, problems: chapterProblems(parsed.chapters, parsed.unreadable) };
}
