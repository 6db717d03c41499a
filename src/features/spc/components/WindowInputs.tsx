import { useState } from 'react';
import { Button } from '../../../components/Button';
import type { ChartWindow } from '../api/chart-window';

/** An ISO instant as the value of a datetime-local input (local time, minutes). */
function toLocalInput(iso: string | undefined): string {
  if (!iso) return '';
  const d = new Date(iso);
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
}

const toIso = (local: string) => (local ? new Date(local).toISOString() : undefined);

/**
 * From and to for the chart, lots, capability and new trial limits. Applied together with a
 * button, so typing a date does not fetch a million-value chart for every keystroke.
 */
export function WindowInputs({ window, onChange }: { window: ChartWindow; onChange: (next: ChartWindow) => void }) {
  const [from, setFrom] = useState(toLocalInput(window.from));
  const [to, setTo] = useState(toLocalInput(window.to));
  const backwards = from !== '' && to !== '' && from > to;
  return (
    <form aria-label="Time window" className="flex flex-wrap items-end gap-3"
      onSubmit={(e) => { e.preventDefault(); if (!backwards) onChange({ from: toIso(from), to: toIso(to) }); }}>
      <label className="text-sm">From
        <input type="datetime-local" aria-label="Window from" value={from} onChange={(e) => setFrom(e.target.value)} className="ml-2 rounded border border-graphite-300 px-2 py-1" />
      </label>
      <label className="text-sm">To
        <input type="datetime-local" aria-label="Window to" value={to} onChange={(e) => setTo(e.target.value)} className="ml-2 rounded border border-graphite-300 px-2 py-1" />
      </label>
      <Button type="submit" size="sm" variant="secondary" disabled={backwards}>Show this window</Button>
      <Button type="button" size="sm" variant="secondary" disabled={!window.from && !window.to && !from && !to}
        onClick={() => { setFrom(''); setTo(''); onChange({}); }}>All data</Button>
      {backwards ? <p role="alert" className="text-sm text-fail">“From” is after “to”.</p> : null}
    </form>
  );
}
