import { useSearchParams } from 'react-router-dom';
import { EmptyState } from '../components/EmptyState';
import { PageHeader } from '../components/PageHeader';
import { CharacteristicPicker } from '../features/spc/components/CharacteristicPicker';
import { ChartWorkspace } from '../features/spc/components/ChartWorkspace';

export default function ControlChartsRoute() {
  const [params, setParams] = useSearchParams();
  const product = params.get('product') ?? '';
  const characteristicId = params.get('characteristic') ? Number(params.get('characteristic')) : null;
  return (
    <div>
      <PageHeader title="Control charts" description="Phase I trial limits, the freeze, and how each characteristic behaves against its frozen limits." />
      <CharacteristicPicker
        product={product}
        characteristicId={characteristicId}
        onChange={(next) => setParams(next.characteristicId ? { product: next.product, characteristic: String(next.characteristicId) } : { product: next.product })}
      />
      <div className="mt-4">
        {characteristicId ? <ChartWorkspace characteristicId={characteristicId} /> : <EmptyState title="Choose a characteristic" />}
      </div>
    </div>
  );
}
