import type { ReactNode } from 'react';
import { VerdictBadge } from '../../../../components/VerdictBadge';
import { formatDateTime } from '../../../../lib/format';
import type { TestRun } from '../../api/motor-schemas';
import { CalibrationState } from '../CalibrationState';
import { WaveformPanel } from '../WaveformPanel';
import { MeasurementTable } from './MeasurementTable';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs uppercase tracking-wider text-graphite-500">{label}</dt>
      <dd className="mt-0.5 text-graphite-900">{children}</dd>
    </div>
  );
}

/** One run, collapsible: its summary line always shows; the measurements open on demand. */
export function RunDetails({ serial, run, open }: { serial: string; run: TestRun; open: boolean }) {
  const failedSteps = run.results.filter((result) => result.verdict === 'fail').length;
  return (
    <details open={open} className="group rounded-lg border border-paper-300 bg-white">
      <summary className="flex cursor-pointer flex-wrap items-center gap-x-4 gap-y-1 px-4 py-3 marker:text-graphite-400">
        <span className="font-semibold text-graphite-950">
          Attempt <span className="figures">{run.attempt}</span>
        </span>
        <VerdictBadge verdict={run.verdict} size="sm" />
        <span className="figures text-sm text-graphite-600">{formatDateTime(run.startedAt)}</span>
        <span className="text-sm text-graphite-600">
          station <span className="figures">{run.station.code}</span>
        </span>
        <CalibrationState ok={run.calibrationOk} due={run.calibrationDue} />
        {failedSteps > 0 ? (
          <span className="text-sm font-medium text-fail-ink">
            {failedSteps} failed {failedSteps === 1 ? 'step' : 'steps'}
          </span>
        ) : null}
      </summary>
      <div className="space-y-4 border-t border-paper-200 px-4 py-4">
        <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm md:grid-cols-4 xl:grid-cols-7">
          <Fact label="Run">
            <span className="figures break-all text-xs">{run.runId}</span>
          </Fact>
          <Fact label="Finished">
            <span className="figures">{formatDateTime(run.finishedAt)}</span>
          </Fact>
          <Fact label="Station">
            <span className="figures">{run.station.code}</span>, line {run.station.line}
          </Fact>
          <Fact label="Operator badge">
            <span className="figures">{run.operatorBadge}</span>
          </Fact>
          <Fact label="Program version">
            <span className="figures">{run.programVersion}</span>
          </Fact>
          <Fact label="Limit revision">
            <span className="figures">{run.limitRevision ?? '—'}</span>
          </Fact>
          <Fact label="Calibration due">
            <span className="figures">{run.calibrationDue}</span>
          </Fact>
        </dl>
        <MeasurementTable results={run.results} />
        <WaveformPanel serial={serial} run={run} />
      </div>
    </details>
  );
}
