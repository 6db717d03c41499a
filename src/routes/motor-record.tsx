import type { ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import { EmptyState } from '../components/EmptyState';
import { ErrorNote } from '../components/ErrorNote';
import { HighVoltageCaution } from '../components/HighVoltageCaution';
import { LoadingScreen } from '../components/Spinner';
import { isApiError } from '../lib/api-client';
import { useMotor } from '../features/motors/api/get-motor';
import { isHighVoltageResult } from '../features/motors/components/limits';
import { AuditEventList } from '../features/motors/components/record/AuditEventList';
import { HoldList } from '../features/motors/components/record/HoldList';
import { MotorHeader } from '../features/motors/components/record/MotorHeader';
import { ReworkNoteList } from '../features/motors/components/record/ReworkNoteList';
import { RunDetails } from '../features/motors/components/record/RunDetails';

function Part({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="space-y-3">
      <h2 className="text-lg font-semibold text-graphite-950">{title}</h2>
      {children}
    </section>
  );
}

export default function MotorRecordRoute() {
  const { serial = '' } = useParams();
  const motor = useMotor(serial);

  if (motor.isPending) return <LoadingScreen label="Loading the motor record…" />;
  if (motor.isError) {
    if (isApiError(motor.error) && motor.error.status === 404) {
      return <EmptyState title={`Serial not found: ${serial}`}>No motor with this serial is on record. Check the serial and try again.</EmptyState>;
    }
    return <ErrorNote error={motor.error} title="Could not load the motor record" />;
  }

  const record = motor.data;
  const showsHighVoltage = record.runs.some((run) => run.results.some(isHighVoltageResult));
  return (
    <article className="space-y-8">
      <MotorHeader record={record} />
      <Part title="Holds">
        <HoldList holds={record.holds} />
      </Part>
      <Part title="Test runs">
        {showsHighVoltage ? <HighVoltageCaution context="hipot and insulation results below" /> : null}
        {record.runs.length === 0 ? (
          <p className="text-sm text-graphite-500">Not tested yet.</p>
        ) : (
          record.runs.map((run, index) => <RunDetails key={run.runId} serial={record.serial} run={run} open={index === 0} />)
        )}
      </Part>
      <Part title="Rework notes">
        <ReworkNoteList notes={record.reworkNotes} />
      </Part>
      <Part title="Audit events">
        <AuditEventList events={record.auditEvents} />
      </Part>
    </article>
  );
}
