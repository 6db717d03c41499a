import type { Knex } from 'knex';
import { readShiftCalendar } from './shift-calendar.js';
import { resolveYieldFilter, type YieldFilterInput, type YieldGrouping } from './yield-filter.js';
import { countYieldGroups, type YieldGroup } from './yield-groups.js';
import { countFirstFailures, type ParetoEntry } from './yield-pareto.js';

export type YieldAnswer = { from: string; to: string; groupBy: YieldGrouping; groups: YieldGroup[]; pareto: ParetoEntry[] };

/**
 * First-pass and final yield per group, and the Pareto of failing characteristics, for the motors
 * first tested in the filter's production days. Reads only the rollups, so it is also the
 * benchmark's entry point: `getYield(db, { groupBy: 'day' })` (after rebuildYieldRollups(db) when
 * the data were bulk-loaded around ingest).
 */
export async function getYield(db: Knex, input: YieldFilterInput & { groupBy: YieldGrouping }, now = new Date()): Promise<YieldAnswer> {
  const calendar = await readShiftCalendar(db);
  const filter = await resolveYieldFilter(db, calendar, input, now);
  const [groups, pareto] = await Promise.all([
    countYieldGroups(db, filter, input.groupBy),
    countFirstFailures(db, filter),
  ]);
  return { from: filter.fromDay, to: filter.toDay, groupBy: input.groupBy, groups, pareto };
}
