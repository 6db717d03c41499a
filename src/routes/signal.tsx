import { useParams } from 'react-router-dom';
import { NotBuiltYet } from '../components/NotBuiltYet';

export default function SignalRoute() {
  const { id = '' } = useParams();
  return <NotBuiltYet title="Signal" area="SPC signal" subject={<>Signal <span className="figures">{id}</span></>} />;
}
