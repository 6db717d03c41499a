import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { VerdictBadge } from '../../../components/VerdictBadge';
import { formatCount, formatDateTime, formatPercent } from '../../../lib/format';
import { useCommitUpload } from '../api/commit-upload';
import { useUpload } from '../api/get-upload';
import { isBusy, type UploadReport as Report, type UploadRun } from '../api/upload-schemas';

const outcomeWords: Record<UploadRun['outcome'], string> = {
  new: 'will be stored', stored: 'stored', duplicate: 'already stored: skipped', invalid: 'not stored: see problems',
};

function Counts({ report }: { report: Report }) {
  const { runs, rows } = report;
  const done = report.status === 'committed';
  return (
    <p className="figures text-sm text-graphite-700">
      {formatCount(rows.total)} rows · {done ? `${formatCount(runs.stored)} runs stored` : `${formatCount(runs.new)} runs to store`} ·{' '}
      {formatCount(runs.duplicate)} already stored · {formatCount(runs.invalid)} invalid ({formatCount(rows.failed)} rows)
    </p>
  );
}

/** The dry-run report of one upload, its commit and the progress of a background pass. */
export function UploadReport({ id }: { id: number }) {
  const { data: report, error, isPending } = useUpload(id);
  const commit = useCommitUpload();
  if (isPending) return <Spinner label="Loading the report…" />;
  if (error) return <ErrorNote error={error} title="Could not load the upload" />;
  const busy = isBusy(report.status);
  return (
    <section aria-label={`Upload ${report.fileName}`} className="mt-4 space-y-3 rounded-md border border-paper-300 bg-white p-4">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-semibold">{report.fileName} <span className="text-sm font-normal text-graphite-500">({report.fileType.toUpperCase()}, {report.format})</span></h3>
        <span className="text-sm text-graphite-600">{report.status === 'committed' ? `Committed by ${report.committedBy} on ${formatDateTime(report.committedAt)}` : `Checked ${formatDateTime(report.checkedAt ?? report.createdAt)}`}</span>
      </header>
      <Counts report={report} />
      {busy ? (
        <div>
          <progress className="w-full" max={1} value={report.progress} aria-label="Progress" />
          <Spinner label={`${report.status === 'checking' ? 'Checking' : 'Storing'}: ${formatPercent(report.progress, 0)}`} />
        </div>
      ) : null}
      {report.status === 'failed' ? <p role="alert" className="text-sm text-fail-ink">{report.error}</p> : null}
      {report.status === 'dry-run' || report.status === 'failed' ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => commit.mutate(report.id)} disabled={commit.isPending || (report.status === 'dry-run' && report.runs.new === 0)}>Store the valid runs</Button>
          <span className="text-sm text-graphite-600">Valid runs are stored, each one whole; invalid runs are listed below and not stored. Runs already stored are skipped.</span>
        </div>
      ) : null}
      {commit.error ? <ErrorNote error={commit.error} title="The upload was not committed" /> : null}
      <ProblemList report={report} />
      <RunList runs={report.runList} />
    </section>
  );
}

function ProblemList({ report }: { report: Report }) {
  if (report.problemsTotal === 0) return <p className="text-sm text-graphite-600">No problems found.</p>;
  return (
    <div>
      <h4 className="text-sm font-semibold">Problems ({formatCount(report.problemsTotal)}{report.problemsTotal > report.problems.length ? `, first ${report.problems.length} shown` : ''})</h4>
      <ul className="mt-1 max-h-64 overflow-auto text-sm">
        {report.problems.map((p, i) => (
          <li key={`${p.row}:${p.column}:${i}`}><span className="figures">row {p.row}, column {p.column}</span>: {p.message}</li>
        ))}
      </ul>
    </div>
  );
}

function RunList({ runs }: { runs: UploadRun[] }) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="text-left text-sm font-semibold">Runs in the file</caption>
      <thead><tr><th>Rows</th><th>Serial</th><th>Station</th><th>Started</th><th>Verdict</th><th>Outcome</th></tr></thead>
      <tbody>
        {runs.map((r) => (
          <tr key={`${r.firstRow}`} className="border-t border-paper-200">
            <td className="figures">{r.firstRow === r.lastRow ? r.firstRow : `${r.firstRow}–${r.lastRow}`}</td>
            <td className="figures">{r.serial ?? '—'}</td>
            <td>{r.station ?? '—'}</td>
            <td className="figures">{r.startedAt ?? '—'}</td>
            <td>{r.verdict ? <VerdictBadge verdict={r.verdict} size="sm" /> : '—'}</td>
            <td>{outcomeWords[r.outcome]}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
