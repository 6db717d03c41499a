import { NotBuiltYet } from '../components/NotBuiltYet';

export default function YieldBoardRoute() {
  return <NotBuiltYet title="Yield board" area="yield" />;
}
