import { NotBuiltYet } from '../components/NotBuiltYet';

export default function SetupRoute() {
  return <NotBuiltYet title="Setup" area="setup" />;
}
