import { useSearchParams } from 'react-router-dom';
import { PageHeader } from '../components/PageHeader';
import { SignalInbox } from '../features/signals/components/SignalInbox';
import { SubscriptionToggle } from '../features/signals/components/SubscriptionToggle';

export default function SignalsRoute() {
  const [params] = useSearchParams();
  return (
    <div>
      <PageHeader title="Signals" description="Control chart rules broken on frozen limits, from the first alarm to the disposition." />
      <div className="mb-4"><SubscriptionToggle product={params.get('product') ?? undefined} /></div>
      <SignalInbox />
    </div>
  );
}
