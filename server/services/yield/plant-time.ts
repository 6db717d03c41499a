// Plant wall-clock time from UTC instants, with only the Intl time-zone database (Node's ICU):
// MariaDB's CONVERT_TZ needs time-zone tables that a fresh server does not have.

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterOf(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric',
    });
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** True when the IANA name is one this runtime knows, e.g. "Europe/Berlin". */
export function isKnownTimeZone(timeZone: string): boolean {
  try {
    formatterOf(timeZone);
    return true;
  } catch {
    return false;
  }
}

/** Minutes the plant's clock is ahead of UTC at the instant. */
export function offsetMinutes(timeZone: string, utcMs: number): number {
  const parts = Object.fromEntries(formatterOf(timeZone).formatToParts(new Date(utcMs)).map((p) => [p.type, p.value]));
  const wallMs = Date.UTC(Number(parts.year), Number(parts.month) - 1, Number(parts.day), Number(parts.hour), Number(parts.minute));
  return Math.round((wallMs - Math.floor(utcMs / 60_000) * 60_000) / 60_000);
}

/** The UTC instant at which the plant's clock shows `minute` minutes after midnight of `isoDate`. */
export function utcOfPlantTime(timeZone: string, isoDate: string, minute: number): number {
  const wallMs = Date.parse(`${isoDate}T00:00:00Z`) + minute * 60_000;
  // Two passes settle the offset on either side of a daylight-saving change.
  const guess = wallMs - offsetMinutes(timeZone, wallMs) * 60_000;
  return wallMs - offsetMinutes(timeZone, guess) * 60_000;
}

/** A stretch of time from `fromMs` on during which the plant's clock runs `offset` minutes ahead of UTC. */
export type OffsetSpan = { fromMs: number; offset: number };

/**
 * The zone's offsets between two instants, as spans starting at each change. A UTC day whose two
 * ends share an offset has it throughout (a zone changes at most once a day), so Intl is asked
 * about twice per day, and per quarter hour only on the days of a change.
 */
export function offsetSpans(timeZone: string, fromMs: number, toMs: number): OffsetSpan[] {
  const dayMs = 86_400_000;
  const spans: OffsetSpan[] = [{ fromMs, offset: offsetMinutes(timeZone, fromMs) }];
  for (let day = Math.floor(fromMs / dayMs) * dayMs; day < toMs; day += dayMs) {
    let current = spans[spans.length - 1].offset;
    if (offsetMinutes(timeZone, day + dayMs) === current) continue;
    for (let at = Math.max(day, fromMs); at <= day + dayMs; at += 15 * 60_000) {
      const offset = offsetMinutes(timeZone, at);
      if (offset !== current) {
        spans.push({ fromMs: at, offset });
        current = offset;
      }
    }
  }
  return spans;
}

/** "2026-12-01" plus whole days. */
export function addDays(isoDate: string, days: number): string {
  return new Date(Date.parse(`${isoDate}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

/** ISO 8601 week of a date, "2026-W49" (weeks start on Monday; week 1 holds the first Thursday). */
export function isoWeekOf(isoDate: string): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  const weekday = (date.getUTCDay() + 6) % 7;
  const thursday = new Date(date.getTime() + (3 - weekday) * 86_400_000);
  const yearStart = Date.UTC(thursday.getUTCFullYear(), 0, 1);
  const week = Math.floor((thursday.getTime() - yearStart) / (7 * 86_400_000)) + 1;
  return `${thursday.getUTCFullYear()}-W${String(week).padStart(2, '0')}`;
}

/** The Monday that starts an ISO week key. */
export function mondayOfIsoWeek(weekKey: string): string | null {
  const match = /^(\d{4})-W(\d{2})$/.exec(weekKey);
  if (!match) return null;
  const jan4 = new Date(Date.UTC(Number(match[1]), 0, 4));
  const mondayOfWeek1 = jan4.getTime() - ((jan4.getUTCDay() + 6) % 7) * 86_400_000;
  return new Date(mondayOfWeek1 + (Number(match[2]) - 1) * 7 * 86_400_000).toISOString().slice(0, 10);
}
