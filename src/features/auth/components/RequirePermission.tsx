import { Outlet } from 'react-router-dom';
import { PageHeader } from '../../../components/PageHeader';
import type { Action } from '../../../lib/permissions';
import { roleLabels } from '../../../lib/permissions';
import { useMe } from '../api/get-me';
import { useCan } from '../use-can';

type RequirePermissionProps = {
  action: Action;
};

/** Layout route guard: shows its child screen only when the user holds `action`, otherwise a 403 page. */
export function RequirePermission({ action }: RequirePermissionProps) {
  const allowed = useCan(action);
  const { data: me } = useMe();

  if (allowed) return <Outlet />;

  const role = me ? me.role : 'signed out';
  return (
    <section>
      <PageHeader title="Not permitted" />
      <p className="text-base text-graphite-800">Not permitted for your role ({role}).</p>
      <p className="mt-2 text-sm text-graphite-500">
        This screen needs the permission <span className="figures text-graphite-700">{action}</span>.
        {me ? ` ${roleLabels[me.role]} users do not hold it. ` : ' '}
        Ask your Fluxtrail admin if your work needs it.
      </p>
    </section>
  );
}
