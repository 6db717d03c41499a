import { Fragment, useState } from 'react';
import { Button } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { formatDate } from '../../../lib/format';
import { useCan } from '../../auth/use-can';
import { useSetupStations } from '../api/get-stations';
import { CalibrationPanel } from './CalibrationPanel';
import { CalibrationStateBadge } from './CalibrationStateBadge';
import { StationForm } from './StationForm';

type Panel = { code: string; kind: 'calibration' | 'edit' };

/** Stations with their calibration due dates; an expired calibration says so in words. Admins edit them here. */
export function StationsSection() {
  const canManage = useCan('stations:manage');
  const stations = useSetupStations();
  const [panel, setPanel] = useState<Panel>();
  const [creating, setCreating] = useState(false);
  const isOpen = (code: string, kind: Panel['kind']) => panel?.code === code && panel.kind === kind;
  const toggle = (code: string, kind: Panel['kind']) => setPanel(isOpen(code, kind) ? undefined : { code, kind });

  if (stations.isPending) return <LoadingScreen label="Loading stations…" />;
  if (stations.isError) return <ErrorNote error={stations.error} title="Could not load the stations" />;
  const expired = stations.data.filter((s) => s.calibrationState === 'expired').length;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm text-graphite-700">
          {stations.data.length} stations
          {expired > 0 ? (
            <>; <strong className="font-semibold text-fail-ink">{expired} with an expired calibration</strong> (every motor tested there is held)</>
          ) : null}
          .
        </p>
        {canManage && !creating ? <Button variant="secondary" onClick={() => setCreating(true)}>New station</Button> : null}
      </div>
      {creating ? <StationForm onDone={() => setCreating(false)} /> : null}
      {stations.data.length === 0 ? <EmptyState title="No stations yet">An admin adds the end-of-line stands here.</EmptyState> : (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Stations and calibration</caption>
          <thead className="border-b border-paper-300 text-xs uppercase tracking-wide text-graphite-500">
            <tr><th className="py-2">Code</th><th>Name</th><th>Line</th><th>Kind</th><th>In use</th><th>Calibration due</th><th>Calibration</th><th><span className="sr-only">Actions</span></th></tr>
          </thead>
          <tbody>
            {stations.data.map((s) => (
              <Fragment key={s.code}>
                <tr className={`border-b border-paper-200 ${s.calibrationState === 'expired' ? 'bg-fail-soft' : ''}`}>
                  <td className="figures py-2">{s.code}</td>
                  <td>{s.name}</td>
                  <td>{s.line}</td>
                  <td>{s.kind}</td>
                  <td>{s.active ? 'yes' : 'no'}</td>
                  <td className="figures">{formatDate(s.calibrationDue)}</td>
                  <td><CalibrationStateBadge state={s.calibrationState} /></td>
                  <td className="whitespace-nowrap text-right">
                    {canManage ? (
                      <Button size="sm" variant="quiet" aria-expanded={isOpen(s.code, 'edit')} onClick={() => toggle(s.code, 'edit')}>
                        Edit {s.code}
                      </Button>
                    ) : null}
                    <Button size="sm" variant="quiet" aria-expanded={isOpen(s.code, 'calibration')} onClick={() => toggle(s.code, 'calibration')}>
                      {canManage ? `Calibration of ${s.code}` : `History of ${s.code}`}
                    </Button>
                  </td>
                </tr>
                {isOpen(s.code, 'edit') ? (
                  <tr><td colSpan={8} className="py-2"><StationForm station={s} onDone={() => setPanel(undefined)} /></td></tr>
                ) : null}
                {isOpen(s.code, 'calibration') ? (
                  <tr><td colSpan={8} className="py-2"><CalibrationPanel stationCode={s.code} calibrationDue={s.calibrationDue} canManage={canManage} /></td></tr>
                ) : null}
              </Fragment>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
