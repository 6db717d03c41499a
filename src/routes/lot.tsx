import { useParams } from 'react-router-dom';
import { NotBuiltYet } from '../components/NotBuiltYet';

export default function LotRoute() {
  const { code = '' } = useParams();
  return <NotBuiltYet title="Lot" area="lot" subject={<>Lot <span className="figures">{code}</span></>} />;
}
