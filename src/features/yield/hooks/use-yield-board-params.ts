import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { YieldDrill } from '../api/get-yield-motors';
import type { YieldFilter, YieldGrouping } from '../api/yield-schemas';

const filterKeys = ['from', 'to', 'product', 'line'] as const;
export type BoardFilterKey = (typeof filterKeys)[number];
const groupings: readonly YieldGrouping[] = ['day', 'week', 'shift', 'line', 'station', 'product', 'lot'];

// The open drill-down rides in the URL as `drill=station:EOL-3` or `drill=characteristic:bemf.ke`,
// so a shared link opens the same list of motors.
function parseDrill(value: string | null): YieldDrill | null {
  if (!value) return null;
  const split = value.indexOf(':');
  const kind = value.slice(0, split);
  const key = value.slice(split + 1);
  if (split < 1 || !key) return null;
  if (kind === 'characteristic') return { characteristic: key };
  const groupBy = groupings.find((g) => g === kind);
  return groupBy ? { groupBy, key } : null;
}

export function drillParam(drill: YieldDrill): string {
  return 'characteristic' in drill ? `characteristic:${drill.characteristic}` : `${drill.groupBy}:${drill.key}`;
}

/** The board's filter and open drill-down, read from and written to the URL search params. */
export function useYieldBoardParams() {
  const [searchParams, setSearchParams] = useSearchParams();
  const values = Object.fromEntries(filterKeys.map((key) => [key, searchParams.get(key) ?? ''])) as Record<BoardFilterKey, string>;
  const drillValue = searchParams.get('drill');
  const drill = useMemo(() => parseDrill(drillValue), [drillValue]);
  const { from, to, product, line } = values;
  const filter: YieldFilter = useMemo(
    () => ({ from: from || undefined, to: to || undefined, product: product || undefined, line: line || undefined }),
    [from, to, product, line],
  );

  /** A new filter closes the drill-down, whose bar may no longer exist. */
  const update = useCallback((changes: Partial<Record<BoardFilterKey, string>>) => {
    setSearchParams((current) => {
      const next = new URLSearchParams(current);
      for (const [key, value] of Object.entries(changes)) {
        if (value) next.set(key, value);
        else next.delete(key);
      }
      next.delete('drill');
      return next;
    });
  }, [setSearchParams]);

  const openDrill = useCallback((next: YieldDrill | null) => {
    setSearchParams((current) => {
      const params = new URLSearchParams(current);
      if (next) params.set('drill', drillParam(next));
      else params.delete('drill');
      return params;
    }, { preventScrollReset: true });
  }, [setSearchParams]);

  return { values, filter, drill, update, openDrill };
}
