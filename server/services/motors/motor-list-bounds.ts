import type { Knex } from 'knex';
import type { FilterIds } from './motor-filter-ids.js';
import type { MotorListFilter } from './list-motors.js';
import { motorsThrough } from './motor-list-query.js';

export type SortBounds = {
  serial?: { first: string; last: string };
  testedAt?: { first: Date | null; last: Date | null; untested: boolean };
};

/** Up to this many matching motors, their span is worth finding (one index-only read of them). */
const boundedMatches = 20_000;

/**
 * A filter on the column the list is not sorted by (a serial prefix in time order, a tested window
 * in serial order) leaves the sort's index to be read, in order, past every motor that does not
 * match until a page is full: most of the index when the matches lie far from where it starts.
 * The matches' span in the sort's column is implied by the filters, so it is found first, through
 * the other sort's index (read index-only, at most boundedMatches entries), and given to the page
 * query as a range: the ordered read then starts and ends among the matches. Null when no motor
 * matches; no bounds where no filter is on the other column, or when more than boundedMatches
 * motors match: finding their span would then cost about what the ordered read does, and that
 * read stays within one pass over its index (the list's worst case, measured by the benchmark).
 */
export async function impliedSortBounds(db: Knex, filter: MotorListFilter, ids: FilterIds): Promise<SortBounds | null> {
  const other = filter.sort === 'serial' ? 'lastTestedAt' : 'serial';
  const filtersOther = other === 'lastTestedAt' ? filter.from !== undefined || filter.to !== undefined : filter.serialPrefix !== undefined;
  if (!filtersOther) return {};
  const matches = motorsThrough(db, other, filter, ids).select('motors.serial', 'motors.last_tested_at').limit(boundedMatches + 1).as('matches');
  const span = await db.from(matches).first(
    db.raw('COUNT(*) AS n'), db.raw('MIN(serial) AS first_serial'), db.raw('MAX(serial) AS last_serial'),
    db.raw('MIN(last_tested_at) AS first_tested'), db.raw('MAX(last_tested_at) AS last_tested'), db.raw('SUM(last_tested_at IS NULL) AS untested'),
  );
  const n = Number(span.n);
  if (n === 0) return null;
  if (n > boundedMatches) return {};
  return filter.sort === 'serial'
    ? { serial: { first: span.first_serial, last: span.last_serial } }
    : { testedAt: { first: span.first_tested, last: span.last_tested, untested: Number(span.untested) > 0 } };
}
