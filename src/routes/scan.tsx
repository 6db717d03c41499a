import { NotBuiltYet } from '../components/NotBuiltYet';

export default function ScanRoute() {
  return <NotBuiltYet title="Scan" area="Scan" />;
}
