import { useCallback } from 'react';
import { useLocation, useSearchParams } from 'react-router-dom';
import { z } from 'zod';
import { motorSortKeys, type MotorFilters, type MotorListQuery, type MotorSortKey, type SortOrder } from '../api/get-motors';
import { motorStatusSchema } from '../api/motor-schemas';

export const motorPageSize = 50;

const filterKeys = ['product', 'lot', 'status', 'station', 'from', 'to', 'serialPrefix'] as const;
export type FilterKey = (typeof filterKeys)[number];

// The cursors of earlier pages ride in the history entry, not the URL: the URL stays short and shareable,
// and the browser's own Back button returns to the previous page as well.
const historyStateSchema = z.object({ previousCursors: z.array(z.string()) });

const dayStart = (day: string) => new Date(`${day}T00:00:00`).toISOString();
// The server's `to` is exclusive, so "tested to 3 Dec" asks for everything before 4 Dec 00:00 local time.
const dayAfter = (day: string) => {
  const next = new Date(`${day}T00:00:00`);
  next.setDate(next.getDate() + 1);
  return next.toISOString();
};

/** The Motors list's filters, sort and page, read from and written to the URL search params. */
export function useMotorListParams() {
  const [searchParams, setSearchParams] = useSearchParams();
  const location = useLocation();
  const parsedState = historyStateSchema.safeParse(location.state);
  const previousCursors = parsedState.success ? parsedState.data.previousCursors : [];

  const filters: Record<FilterKey, string> = Object.fromEntries(
    filterKeys.map((key) => [key, searchParams.get(key) ?? '']),
  ) as Record<FilterKey, string>;
  const sortParam = searchParams.get('sort');
  const sort: MotorSortKey = motorSortKeys.find((key) => key === sortParam) ?? 'lastTestedAt';
  const order: SortOrder = searchParams.get('order') === 'asc' ? 'asc' : 'desc';
  const cursor = searchParams.get('cursor') ?? undefined;

  const status = motorStatusSchema.safeParse(filters.status);
  const serverFilters: MotorFilters = {
    product: filters.product || undefined,
    lot: filters.lot || undefined,
    status: status.success ? status.data : undefined,
    station: filters.station || undefined,
    from: filters.from ? dayStart(filters.from) : undefined,
    to: filters.to ? dayAfter(filters.to) : undefined,
    serialPrefix: filters.serialPrefix || undefined,
  };
  const query: MotorListQuery = { ...serverFilters, sort, order, limit: motorPageSize, cursor };

  /** Any change of filter or sort starts again at the first page. */
  const update = useCallback(
    (changes: Partial<Record<FilterKey | 'sort' | 'order', string>>) => {
      setSearchParams((current) => {
        const next = new URLSearchParams(current);
        for (const [key, value] of Object.entries(changes)) {
          if (value) next.set(key, value);
          else next.delete(key);
        }
        next.delete('cursor');
        return next;
      }, { replace: true });
    },
    [setSearchParams],
  );

  const goToPage = useCallback(
    (nextCursor: string | undefined, nextPrevious: string[]) => {
      setSearchParams(
        (current) => {
          const next = new URLSearchParams(current);
          if (nextCursor) next.set('cursor', nextCursor);
          else next.delete('cursor');
          return next;
        },
        { state: { previousCursors: nextPrevious } },
      );
    },
    [setSearchParams],
  );

  // An empty string in the stack stands for the first page (which has no cursor).
  const next = (nextCursor: string) => goToPage(nextCursor, [...previousCursors, cursor ?? '']);
  const previous = () => goToPage(previousCursors.at(-1) || undefined, previousCursors.slice(0, -1));
  const first = () => goToPage(undefined, []);

  return {
    filters,
    sort,
    order,
    query,
    pageNumber: previousCursors.length + 1,
    onFirstPage: cursor === undefined,
    update,
    clear: () => setSearchParams(new URLSearchParams(), { replace: true }),
    paging: { next, previous, first, canGoBack: previousCursors.length > 0 },
  };
}
