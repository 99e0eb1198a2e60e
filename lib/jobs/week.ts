/**
 * ISO 8601 weeks (Monday first; week 1 holds the year's first Thursday) for the schedule.
 * Calendar dates only (`YYYY-MM-DD`), computed in UTC so the server's time zone cannot shift a day.
 */
export type IsoWeek = { year: number; week: number; label: string; monday: string };

const DAY_MS = 86_400_000;

export function parseCalendarDate(text: string): Date | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return null;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3]) ? d : null;
}

const ymd = (d: Date) => d.toISOString().slice(0, 10);

export function isoWeekOf(dateText: string): IsoWeek | null {
  const d = parseCalendarDate(dateText);
  if (!d) return null;
  const weekday = (d.getUTCDay() + 6) % 7; // Monday 0 … Sunday 6
  const monday = new Date(d.getTime() - weekday * DAY_MS);
  const thursday = new Date(monday.getTime() + 3 * DAY_MS);
  const year = thursday.getUTCFullYear();
  const jan1 = Date.UTC(year, 0, 1);
  const week = Math.floor((thursday.getTime() - jan1) / DAY_MS / 7) + 1;
  return { year, week, label: `${year}-W${String(week).padStart(2, "0")}`, monday: ymd(monday) };
}
