import { NotBuiltYet } from '../components/NotBuiltYet';

export default function LotsRoute() {
  return <NotBuiltYet title="Lots" area="lot" />;
}
