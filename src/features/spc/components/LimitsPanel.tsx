import { useState } from 'react';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCan } from '../../auth/use-can';
import { useComputeTrialLimits } from '../api/compute-trial-limits';
import { useExcludePoint } from '../api/exclude-point';
import { useFreezeLimits } from '../api/freeze-limits';
import type { ChartWindow } from '../api/chart-window';
import type { ChartData, Limits } from '../api/spc-schemas';
import { RulePicker } from './RulePicker';

const kindNames: Record<Limits['chartKind'], string> = {
  individuals: 'Individuals (every run)',
  'xbar-s-lot': 'Mean and std dev per lot',
  'xbar-s-consecutive': 'Mean and std dev per n consecutive motors',
  ewma: 'EWMA',
  cusum: 'CUSUM',
};

function LimitsFacts({ limits }: { limits: Limits }) {
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
      <dt className="text-graphite-500">Chart</dt><dd>{kindNames[limits.chartKind]}</dd>
      <dt className="text-graphite-500">Centre</dt><dd className="figures">{limits.centre.toPrecision(6)}</dd>
      <dt className="text-graphite-500">UCL / LCL</dt><dd className="figures">{limits.ucl.toPrecision(6)} / {limits.lcl.toPrecision(6)}</dd>
      <dt className="text-graphite-500">Baseline</dt><dd>runs {limits.baseline.fromRunId}–{limits.baseline.toRunId}, {limits.baseline.points} points</dd>
      <dt className="text-graphite-500">Rules</dt><dd>{limits.rules.join(', ')}</dd>
      <dt className="text-graphite-500">Excluded</dt><dd>{limits.exclusions.length}</dd>
    </dl>
  );
}

/** Phase I and II in one place: the limits in force, the trial being prepared, and its actions. */
export function LimitsPanel({ data, window }: { data: ChartData; window: ChartWindow }) {
  const canManage = useCan('spc:manage');
  const [kind, setKind] = useState<Limits['chartKind']>('individuals');
  const [excludeRun, setExcludeRun] = useState('');
  const [reason, setReason] = useState('');
  // null until the engineer touches a box: the server's defaults are then sent as no choice at all.
  const [rules, setRules] = useState<string[] | null>(null);
  const compute = useComputeTrialLimits();
  const exclude = useExcludePoint();
  const freeze = useFreezeLimits();
  const { trial, frozen } = data.limits;
  const characteristicId = data.characteristic.id;
  return (
    <section aria-label="Control limits" className="space-y-4 rounded-md border border-paper-300 bg-white p-4">
      {frozen ? (
        <div>
          <h3 className="font-semibold">Frozen limits in force</h3>
          <p className="text-sm text-graphite-500">Frozen by {frozen.frozenBy} on {frozen.frozenAt?.slice(0, 16).replace('T', ' ')}; new runs are judged against these.</p>
          <LimitsFacts limits={frozen} />
        </div>
      ) : <p role="note" className="text-sm">No frozen limits: new runs are not judged yet.</p>}
      {trial ? (
        <div className="rounded-md border border-hold/50 bg-hold-soft p-3">
          <h3 className="font-semibold">Trial limits (not yet frozen)</h3>
          <p className="text-sm">Computed by {trial.computedBy}. These are trial limits: review the points, exclude those with an assignable cause, then freeze.</p>
          <LimitsFacts limits={trial} />
          {canManage ? (
            <div className="mt-3 flex flex-wrap items-end gap-2">
              <label className="text-sm">Run to exclude
                <input aria-label="Run to exclude" value={excludeRun} onChange={(e) => setExcludeRun(e.target.value)} className="ml-2 w-28 rounded border border-graphite-300 px-2 py-1" inputMode="numeric" />
              </label>
              <label className="text-sm">Assignable cause
                <input aria-label="Assignable cause" value={reason} onChange={(e) => setReason(e.target.value)} className="ml-2 w-64 rounded border border-graphite-300 px-2 py-1" />
              </label>
              <Button variant="secondary" size="sm" disabled={exclude.isPending}
                onClick={() => exclude.mutate({ characteristicId, limitId: trial.id, ...(trial.chartKind === 'xbar-s-lot' ? { lotId: Number(excludeRun) } : { runId: Number(excludeRun) }), reason })}>
                Exclude point
              </Button>
              <Button size="sm" disabled={freeze.isPending} onClick={() => freeze.mutate({ characteristicId, limitId: trial.id })}>Freeze these limits</Button>
            </div>
          ) : null}
        </div>
      ) : null}
      {canManage ? (
        <div className="space-y-3">
          {kind === 'individuals' || kind === 'xbar-s-lot' || kind === 'xbar-s-consecutive'
            ? <RulePicker chosen={rules} onChange={setRules} />
            : <p className="text-sm text-graphite-500">EWMA and CUSUM signal on their own limits; they take no run rules.</p>}
        <div className="flex flex-wrap items-end gap-2">
          <label className="text-sm">Chart for new trial limits
            <select aria-label="Chart kind" value={kind} onChange={(e) => setKind(e.target.value as Limits['chartKind'])} className="ml-2 rounded border border-graphite-300 px-2 py-1">
              {Object.entries(kindNames).map(([value, name]) => <option key={value} value={value}>{name}</option>)}
            </select>
          </label>
          <Button variant="secondary" size="sm" disabled={compute.isPending}
            onClick={() => compute.mutate({ characteristicId, chartKind: kind, ...window, ...(rules && rules.length > 0 ? { rules } : {}) })}>
            {window.from || window.to ? 'Compute trial limits from this window' : 'Compute trial limits from all data'}
          </Button>
        </div>
        </div>
      ) : null}
      {[compute.error, exclude.error, freeze.error].filter(Boolean).map((error, i) => <ErrorNote key={i} error={error} title="Not saved" />)}
    </section>
  );
}
