import { useParams } from 'react-router-dom';
import { NotBuiltYet } from '../components/NotBuiltYet';

export default function MotorRecordRoute() {
  const { serial = '' } = useParams();
  return <NotBuiltYet title="Motor record" area="motor record" subject={<>Serial <span className="figures">{serial}</span></>} />;
}
