import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { calibrationSchema } from '../../../../server/schemas/setup';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { formatDate, formatDateTime } from '../../../lib/format';
import { useCalibrations } from '../api/get-calibrations';
import { useRecordCalibration } from '../api/record-calibration';
import { todayIso } from './ExpiredDueNote';
import { Field, inputClass } from './form-parts';

type Values = z.input<typeof calibrationSchema>;

type CalibrationPanelProps = { stationCode: string; calibrationDue: string; canManage: boolean };

/**
 * Records a calibration (admins) and shows the station's calibration history. A due date moved by
 * editing the station differs from the latest certificate's; the panel says so rather than let the
 * history look as if it explained the date in force.
 */
export function CalibrationPanel({ stationCode, calibrationDue, canManage }: CalibrationPanelProps) {
  const history = useCalibrations(stationCode);
  const record = useRecordCalibration(stationCode);
  const { register, handleSubmit, reset, formState: { errors } } = useForm<Values, unknown, z.output<typeof calibrationSchema>>({
    resolver: zodResolver(calibrationSchema),
    defaultValues: { calibratedOn: todayIso(), due: '', certificate: '', reason: '' },
  });
  const onSubmit = handleSubmit(async (values) => {
    await record.mutateAsync({ ...values, certificate: values.certificate || null });
    reset({ calibratedOn: todayIso(), due: '', certificate: '', reason: '' });
  });
  const id = (name: string) => `calibration-${stationCode}-${name}`;

  return (
    <div className="space-y-3 rounded-md bg-paper-100 p-3">
      {canManage ? (
        <form onSubmit={onSubmit} aria-label={`Record a calibration of ${stationCode}`} className="grid grid-cols-2 gap-3 md:grid-cols-5">
          <Field id={id('on')} label="Calibrated on" error={errors.calibratedOn}>
            <input id={id('on')} type="date" className={`${inputClass} figures`} {...register('calibratedOn')} />
          </Field>
          <Field id={id('due')} label="Next due" error={errors.due}>
            <input id={id('due')} type="date" className={`${inputClass} figures`} {...register('due')} />
          </Field>
          <Field id={id('certificate')} label="Certificate" error={errors.certificate}>
            <input id={id('certificate')} className={`${inputClass} figures`} {...register('certificate')} />
          </Field>
          <Field id={id('reason')} label="Reason" error={errors.reason}>
            <input id={id('reason')} className={inputClass} {...register('reason')} />
          </Field>
          <div className="flex items-end"><Button type="submit" size="sm" disabled={record.isPending}>Record calibration</Button></div>
          {record.error ? <div className="col-span-2 md:col-span-5"><ErrorNote error={record.error} title="The calibration was not recorded" /></div> : null}
        </form>
      ) : null}
      {history.isPending ? <Spinner label="Loading the history…" /> : null}
      {history.isError ? <ErrorNote error={history.error} title="Could not load the calibration history" /> : null}
      {history.data?.[0] && history.data[0].due !== calibrationDue ? (
        <p role="note" className="text-sm text-graphite-700">
          The due date in force, <span className="figures">{formatDate(calibrationDue)}</span>, was set by editing the station
          (its reason is in the audit trail); the latest recorded calibration gave <span className="figures">{formatDate(history.data[0].due)}</span>.
        </p>
      ) : null}
      {history.data ? (
        <table className="w-full text-left text-sm">
          <caption className="mb-1 text-left text-xs font-medium uppercase tracking-wide text-graphite-600">Calibration history of {stationCode}</caption>
          <thead className="text-xs text-graphite-500"><tr><th>Calibrated on</th><th>Due</th><th>Certificate</th><th>Recorded</th></tr></thead>
          <tbody>
            {history.data.length === 0 ? <tr><td colSpan={4} className="py-2 text-graphite-500">No calibration recorded in Fluxtrail yet.</td></tr> : null}
            {history.data.map((c) => (
              <tr key={c.id} className="border-t border-paper-300">
                <td className="figures py-1">{formatDate(c.calibratedOn)}</td>
                <td className="figures">{formatDate(c.due)}</td>
                <td className="figures">{c.certificate ?? '—'}</td>
                <td>{c.recordedBy}, {formatDateTime(c.recordedAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
