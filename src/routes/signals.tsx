import { NotBuiltYet } from '../components/NotBuiltYet';

export default function SignalsRoute() {
  return <NotBuiltYet title="Signals" area="SPC signal" />;
}
