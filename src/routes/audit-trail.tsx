import { NotBuiltYet } from '../components/NotBuiltYet';

export default function AuditTrailRoute() {
  return <NotBuiltYet title="Audit trail" area="audit trail" />;
}
