import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { paths } from '../../../lib/paths';
import { useWhereUsed } from '../api/get-where-used';
import type { PackFilter } from '../api/pack-schemas';

/**
 * "Supplier lot trace": which of our lots and motors contain a supplier's component lot (a recall
 * question), with a one-click pack for exactly those lots.
 */
export function ComponentLotTrace({ onBuildPack }: { onBuildPack?: (draft: PackFilter) => void }) {
  const [input, setInput] = useState('');
  const [code, setCode] = useState('');
  const result = useWhereUsed(code);
  const submit = (event: FormEvent) => { event.preventDefault(); setCode(input.trim()); };
  const held = result.data?.motors.filter((m) => m.onHold).length ?? 0;

  return (
    <section className="rounded-lg border border-paper-300 bg-white p-4" aria-labelledby="trace-title">
      <h2 id="trace-title" className="mb-3 text-base font-semibold text-graphite-900">Supplier lot trace</h2>
      <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-xs text-graphite-600">Supplier component lot (stator, magnet, rotor, resolver)
          <input data-testid="trace-code" className="figures h-9 rounded-md border border-graphite-300 px-2 text-sm" value={input} onChange={(e) => setInput(e.target.value)} />
        </label>
        <Button type="submit" variant="secondary" data-testid="trace-search" disabled={!input.trim()}>Find where used</Button>
      </form>
      {result.isFetching ? <div className="mt-3"><Spinner label="Searching…" /></div> : null}
      {result.error ? <div className="mt-3"><ErrorNote error={result.error} title="The search failed" /></div> : null}
      {result.data ? (
        <div data-testid="trace-result" className="mt-3 text-sm">
          {result.data.lots.length === 0 ? <p>No Fluxtrail lot contains component lot <span className="figures">{result.data.componentLot}</span>.</p> : (
            <>
              <p className="mb-2">
                {result.data.lots.length} lot(s), {result.data.motors.length}{result.data.motorsTruncated ? '+' : ''} motor(s); {held} on hold.
              </p>
              <ul className="mb-2 flex flex-wrap gap-2">
                {result.data.lots.map((lot) => (
                  <li key={`${lot.code}-${lot.componentKind}`} data-testid="trace-lot" className="rounded border border-paper-300 px-2 py-1">
                    <Link className="figures underline" to={paths.lot.href(lot.code)}>{lot.code}</Link> · {lot.product} · {lot.componentKind} · {lot.motorCount} motors
                    {lot.onHold ? <span className="ml-1 text-hold-ink">▲ lot on hold</span> : null}
                  </li>
                ))}
              </ul>
              <div className="max-h-64 overflow-auto">
                <table data-testid="trace-motors" className="w-full text-left text-sm">
                  <thead className="text-xs uppercase text-graphite-600"><tr><th>Serial</th><th>Lot</th><th>Status</th><th>Hold</th></tr></thead>
                  <tbody>
                    {result.data.motors.map((m) => (
                      <tr key={m.serial} className="border-t border-paper-200">
                        <td className="figures"><Link className="underline" to={paths.motorRecord.href(m.serial)}>{m.serial}</Link></td>
                        <td className="figures">{m.lot}</td><td>{m.status}</td><td>{m.onHold ? '▲ on hold' : '—'}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              {onBuildPack ? (
                <Button className="mt-3" data-testid="trace-build-pack" onClick={() => onBuildPack({ lots: [...new Set(result.data!.lots.map((l) => l.code))] })}>
                  Build evidence pack from this
                </Button>
              ) : null}
            </>
          )}
        </div>
      ) : null}
    </section>
  );
}
