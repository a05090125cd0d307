/**
 * Calendar-day arithmetic on "YYYY-MM-DD" strings, counted in UTC so no zone can shift a day. Weeks
 * start on Monday (ISO 8601, section 2.2.8 "calendar week"); a month is shown as the six weeks that hold it.
 */
const DAY = 86_400_000;
const toTime = (day: string) => Date.parse(`${day}T00:00:00Z`);
const fromTime = (time: number) => new Date(time).toISOString().slice(0, 10);

export const addDays = (day: string, n: number) => fromTime(toTime(day) + n * DAY);

/** 1 Monday … 7 Sunday, as ISO 8601 numbers the days of the week. */
export const isoWeekday = (day: string) => ((new Date(toTime(day)).getUTCDay() + 6) % 7) + 1;

export const startOfWeek = (day: string) => addDays(day, 1 - isoWeekday(day));
export const startOfMonth = (day: string) => `${day.slice(0, 8)}01`;

export function addMonths(day: string, n: number): string {
  const date = new Date(toTime(startOfMonth(day)));
  date.setUTCMonth(date.getUTCMonth() + n);
  return fromTime(date.getTime());
}

/** The days from `from` to `to`, both included. */
export function daysBetween(from: string, to: string): string[] {
  const days: string[] = [];
  for (let day = from; day <= to; day = addDays(day, 1)) days.push(day);
  return days;
}

/** The 42 days of the six weeks that show a month, Monday first. */
export function monthGrid(day: string): string[] {
  const first = startOfWeek(startOfMonth(day));
  return daysBetween(first, addDays(first, 41));
}

export const weekDays = (day: string) => daysBetween(startOfWeek(day), addDays(startOfWeek(day), 6));

const monthNames = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];
/** "May 2031". */
export const monthTitle = (day: string) => `${monthNames[Number(day.slice(5, 7)) - 1]} ${day.slice(0, 4)}`;
