/** The time window every SPC read shares: ISO instants, either end open. */
export type ChartWindow = { from?: string; to?: string };

/** `?from=…&to=…` for the set ends, so the query key and the URL say the same thing. */
export function windowSearch(window: ChartWindow): string {
  const params = new URLSearchParams();
  if (window.from) params.set('from', window.from);
  if (window.to) params.set('to', window.to);
  const text = params.toString();
  return text ? `?${text}` : '';
}
