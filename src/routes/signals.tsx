import { PageHeader } from '../components/PageHeader';
import { SignalInbox } from '../features/signals/components/SignalInbox';

export default function SignalsRoute() {
  return (
    <div>
      <PageHeader title="Signals" description="Control chart rules broken on frozen limits, from the first alarm to the disposition." />
      <SignalInbox />
    </div>
  );
}
