import { NotBuiltYet } from '../components/NotBuiltYet';

export default function EvidencePacksRoute() {
  return <NotBuiltYet title="Evidence packs" area="evidence pack" />;
}
