import { useState, type ChangeEvent, type FormEvent } from 'react';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCreateEvidencePack } from '../api/create-evidence-pack';
import type { PackFilter } from '../api/pack-schemas';

const inputClass = 'h-9 rounded-md border border-graphite-300 bg-white px-2 text-sm';
/** Serials and lots may be pasted one per line, or separated by commas, semicolons or spaces. */
const splitList = (text: string) => text.split(/[\s,;]+/).map((s) => s.trim()).filter(Boolean);

function field(label: string, input: React.ReactNode) {
  return <label className="flex flex-col gap-1 text-xs text-graphite-600">{label}{input}</label>;
}

/** Defines a pack. Empty fields are left out; the server insists on at least one criterion. */
export function PackForm({ draft }: { draft?: PackFilter }) {
  const create = useCreateEvidencePack();
  const [serialFrom, setSerialFrom] = useState(draft?.serialFrom ?? '');
  const [serialTo, setSerialTo] = useState(draft?.serialTo ?? '');
  const [serials, setSerials] = useState((draft?.serials ?? []).join('\n'));
  const [lots, setLots] = useState((draft?.lots ?? []).join(', '));
  const [product, setProduct] = useState(draft?.product ?? '');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');

  const readFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (file) setSerials(splitList(await file.text()).join('\n'));
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const serialList = splitList(serials);
    const lotList = splitList(lots);
    create.mutate({
      ...(serialList.length ? { serials: serialList } : {}),
      ...(serialFrom.trim() ? { serialFrom: serialFrom.trim() } : {}),
      ...(serialTo.trim() ? { serialTo: serialTo.trim() } : {}),
      ...(lotList.length ? { lots: lotList } : {}),
      ...(product.trim() ? { product: product.trim() } : {}),
      ...(from ? { from: new Date(`${from}T00:00:00`).toISOString() } : {}),
      ...(to ? { to: new Date(new Date(`${to}T00:00:00`).getTime() + 86_400_000).toISOString() } : {}),
    });
  };

  return (
    <form data-testid="pack-form" onSubmit={submit} className="rounded-lg border border-paper-300 bg-white p-4" aria-labelledby="pack-form-title">
      <h2 id="pack-form-title" className="mb-3 text-base font-semibold text-graphite-900">New evidence pack</h2>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {field('Serial from', <input data-testid="pack-serial-from" className={`${inputClass} figures`} value={serialFrom} onChange={(e) => setSerialFrom(e.target.value)} />)}
        {field('Serial to', <input data-testid="pack-serial-to" className={`${inputClass} figures`} value={serialTo} onChange={(e) => setSerialTo(e.target.value)} />)}
        {field('Lots (comma-separated)', <input data-testid="pack-lots" className={`${inputClass} figures`} value={lots} onChange={(e) => setLots(e.target.value)} />)}
        {field('Product code', <input data-testid="pack-product" className={`${inputClass} figures`} value={product} onChange={(e) => setProduct(e.target.value)} />)}
        {field('Tested from', <input type="date" data-testid="pack-from" className={inputClass} value={from} onChange={(e) => setFrom(e.target.value)} />)}
        {field('Tested to (inclusive)', <input type="date" data-testid="pack-to" className={inputClass} value={to} onChange={(e) => setTo(e.target.value)} />)}
      </div>
      <div className="mt-3 grid gap-2">
        {field('Serials, pasted (one per line)', <textarea data-testid="pack-serials" rows={3} className="figures rounded-md border border-graphite-300 p-2 text-sm" value={serials} onChange={(e) => setSerials(e.target.value)} />)}
        {field('…or a text/CSV file of serials', <input type="file" accept=".txt,.csv,text/plain,text/csv" data-testid="pack-serials-file" onChange={(e) => void readFile(e)} />)}
      </div>
      <div className="mt-4 flex items-center gap-3">
        <Button type="submit" data-testid="pack-create" disabled={create.isPending}>Build pack</Button>
        {create.data ? <span role="status" className="text-sm text-graphite-600">Pack {create.data.id} queued.</span> : null}
      </div>
      {create.error ? <div className="mt-3"><ErrorNote error={create.error} title="The pack was not queued" /></div> : null}
    </form>
  );
}
