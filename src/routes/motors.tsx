import { NotBuiltYet } from '../components/NotBuiltYet';

export default function MotorsRoute() {
  return <NotBuiltYet title="Motors" area="motor record" />;
}
