import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '../components/EmptyState';
import { PageHeader } from '../components/PageHeader';
import { CharacteristicPicker } from '../features/spc/components/CharacteristicPicker';
import { ChartWorkspace } from '../features/spc/components/ChartWorkspace';
import { WindowInputs } from '../features/spc/components/WindowInputs';
import type { ChartWindow } from '../features/spc/api/chart-window';

export default function ControlChartsRoute() {
  const [params, setParams] = useSearchParams();
  const product = params.get('product') ?? '';
  const characteristicId = params.get('characteristic') ? Number(params.get('characteristic')) : null;
  const window: ChartWindow = { from: params.get('from') ?? undefined, to: params.get('to') ?? undefined };
  const setWindow = (next: ChartWindow) => {
    const search = new URLSearchParams(params);
    for (const end of ['from', 'to'] as const) { const value = next[end]; if (value) search.set(end, value); else search.delete(end); }
    setParams(search);
  };
  return (
    <div>
      <PageHeader title="Control charts" description="Phase I trial limits, the freeze, and how each characteristic behaves against its frozen limits." />
      <CharacteristicPicker
        product={product}
        characteristicId={characteristicId}
        onChange={(next) => setParams({ product: next.product, ...(next.characteristicId ? { characteristic: String(next.characteristicId) } : {}), ...(window.from ? { from: window.from } : {}), ...(window.to ? { to: window.to } : {}) })}
      />
      <div className="mt-3"><WindowInputs key={`${window.from}-${window.to}`} window={window} onChange={setWindow} /></div>
      <div className="mt-4">
        {characteristicId ? <ChartWorkspace characteristicId={characteristicId} window={window} /> : <EmptyState title="Choose a characteristic" />}
      </div>
    </div>
  );
}
