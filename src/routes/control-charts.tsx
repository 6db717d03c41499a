import { NotBuiltYet } from '../components/NotBuiltYet';

export default function ControlChartsRoute() {
  return <NotBuiltYet title="Control charts" area="SPC" />;
}
