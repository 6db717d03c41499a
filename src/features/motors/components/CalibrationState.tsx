import { StatusShape } from '../../../components/StatusShape';
import { formatDate } from '../../../lib/format';

type CalibrationStateProps = {
  ok: boolean;
  due: string;
  size?: 'sm' | 'lg';
};

// A bare calendar date ("2027-03-31") is shown as it is; parsing it as UTC midnight could shift the day.
const showDue = (due: string) => (/^\d{4}-\d{2}-\d{2}$/.test(due) ? due : formatDate(due));

/** The station's calibration when the run was taken: word and shape, with the due date. */
export function CalibrationState({ ok, due, size = 'sm' }: CalibrationStateProps) {
  const text = size === 'lg' ? 'text-lg' : 'text-sm';
  const shape = size === 'lg' ? 'h-5 w-5' : 'h-3.5 w-3.5';
  return (
    <span className={`inline-flex flex-wrap items-center gap-x-1.5 font-medium ${text} ${ok ? 'text-pass-ink' : 'text-fail-ink'}`}>
      <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
        <StatusShape kind={ok ? 'pass' : 'fail'} className={`${shape} ${ok ? 'text-pass' : 'text-fail'}`} />
        {ok ? 'Calibration OK' : 'Calibration expired'}
      </span>
      <span className="figures whitespace-nowrap font-normal text-graphite-500">(due {showDue(due)})</span>
    </span>
  );
}
