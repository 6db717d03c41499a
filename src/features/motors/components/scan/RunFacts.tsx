import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../../lib/format';
import { paths } from '../../../../lib/paths';
import type { MotorRecord, TestRun } from '../../api/motor-schemas';
import { CalibrationState } from '../CalibrationState';

function Fact({ label, children, wide = false }: { label: string; children: ReactNode; wide?: boolean }) {
  return (
    <div className={wide ? 'col-span-2' : undefined}>
      <dt className="text-sm uppercase tracking-wider text-graphite-500">{label}</dt>
      <dd className="mt-0.5 text-xl text-graphite-950">{children}</dd>
    </div>
  );
}

/** Where the answer comes from: product, lot, attempt, station and whether the station was in calibration. */
export function RunFacts({ record, run }: { record: MotorRecord; run?: TestRun }) {
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-3 rounded-lg border border-paper-300 bg-white px-5 py-4 md:grid-cols-3">
      <Fact label="Product" wide>
        {record.product.name} <span className="figures text-base text-graphite-500">{record.product.code}</span>
      </Fact>
      <Fact label="Lot">
        <Link to={paths.lot.href(record.lot.code)} className="figures text-copper-700 underline-offset-4 hover:underline">
          {record.lot.code}
        </Link>
      </Fact>
      <Fact label="Attempt">
        {run ? <span className="figures">{run.attempt}</span> : '—'}
        {run ? <span className="block text-sm text-graphite-500">{formatDateTime(run.finishedAt)}</span> : null}
      </Fact>
      <Fact label="Station">
        {run ? (
          <>
            <span className="figures">{run.station.code}</span>{' '}
            <span className="text-base text-graphite-500">line {run.station.line}</span>
          </>
        ) : (
          '—'
        )}
      </Fact>
      <Fact label="Station calibration">
        {run ? <CalibrationState ok={run.calibrationOk} due={run.calibrationDue} size="lg" /> : '—'}
      </Fact>
    </dl>
  );
}
