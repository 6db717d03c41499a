import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../../components/Button';
import { HighVoltageCaution } from '../../../../components/HighVoltageCaution';
import { paths } from '../../../../lib/paths';
import type { MotorRecord } from '../../api/motor-schemas';
import type { ReworkAction } from '../../api/record-rework-note';
import { isHighVoltageResult } from '../limits';
import { ReworkDialog } from '../ReworkDialog';
import { ReleaseDecisionPanel } from './ReleaseDecisionPanel';
import { RunFacts } from './RunFacts';
import { ScanStepList } from './ScanStepList';
import { decideRelease } from './release-decision';

type ScanAnswerProps = {
  record: MotorRecord;
  canRework: boolean;
  canRetest: boolean;
  /** Called when the note dialog closes, so the serial field can take the focus back. */
  onDialogClosed: () => void;
};

/** Everything the operator needs at the bench about one scanned motor. */
export function ScanAnswer({ record, canRework, canRetest, onDialogClosed }: ScanAnswerProps) {
  const release = decideRelease(record);
  const [dialog, setDialog] = useState<ReworkAction>();
  const results = release.latestRun?.results ?? [];

  return (
    <div className="space-y-5">
      <ReleaseDecisionPanel serial={record.serial} release={release} />
      <div className="flex flex-wrap gap-3">
        {canRework ? (
          <Button size="glove" variant="secondary" onClick={() => setDialog('rework')}>
            Record rework
          </Button>
        ) : null}
        {canRetest ? (
          <Button size="glove" variant="secondary" onClick={() => setDialog('retest')}>
            Send to retest
          </Button>
        ) : null}
        <Link
          to={paths.motorRecord.href(record.serial)}
          className="inline-flex min-h-14 items-center px-4 text-lg text-copper-700 underline underline-offset-4"
        >
          Open motor record
        </Link>
      </div>
      <RunFacts record={record} run={release.latestRun} />
      {release.latestRun ? (
        <section aria-labelledby="scan-steps-title" className="space-y-3">
          <h2 id="scan-steps-title" className="text-xl font-semibold">
            Latest run, attempt <span className="figures">{release.latestRun.attempt}</span>
          </h2>
          {results.some(isHighVoltageResult) ? <HighVoltageCaution context="hipot and insulation results" /> : null}
          <ScanStepList results={results} />
        </section>
      ) : null}
      <ReworkDialog
        serial={record.serial}
        action={dialog}
        onClose={() => {
          setDialog(undefined);
          onDialogClosed();
        }}
      />
    </div>
  );
}
