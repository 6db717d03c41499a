import { useParams } from 'react-router-dom';
import { PageHeader } from '../components/PageHeader';
import { SignalRecord } from '../features/signals/components/SignalRecord';

export default function SignalRoute() {
  const { id = '' } = useParams();
  return (
    <div>
      <PageHeader title={`Signal ${id}`} description="Investigate, contain and close." />
      <SignalRecord id={id} />
    </div>
  );
}
