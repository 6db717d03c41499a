const dayMs = 86_400_000;

/**
 * The demo's calendar: everything is placed relative to the start of the current UTC day, so the
 * plant always looks freshly run, and within one day the same seed gives the same timestamps.
 */
export type DemoClock = {
  /** 00:00 UTC today; all production lies before it. */
  today: Date;
  /** The moment `days` (fractional) before today 00:00. */
  at(daysAgo: number): Date;
  /** The calendar date (YYYY-MM-DD) `days` before today. */
  day(daysAgo: number): string;
};

export function demoClock(now: Date): DemoClock {
  const today = new Date(Math.floor(now.getTime() / dayMs) * dayMs);
  const at = (daysAgo: number) => new Date(today.getTime() - daysAgo * dayMs);
  return { today, at, day: (daysAgo) => at(daysAgo).toISOString().slice(0, 10) };
}

export const hourMs = 3_600_000;
export const minuteMs = 60_000;
