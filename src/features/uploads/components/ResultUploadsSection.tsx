import { useState } from 'react';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { formatDateTime } from '../../../lib/format';
import { useCan } from '../../auth/use-can';
import { useUploads } from '../api/get-uploads';
import { UploadForm } from './UploadForm';
import { UploadReport } from './UploadReport';

/** Result uploads: historical or offline runs from a file, checked first, then stored. */
export function ResultUploadsSection() {
  const allowed = useCan('uploads:commit');
  const [selected, setSelected] = useState<number>();
  const uploads = useUploads();
  if (!allowed) return <p className="text-sm text-graphite-600">Uploading results is for quality engineers and admins.</p>;
  return (
    <div className="space-y-4">
      <p className="max-w-3xl text-sm text-graphite-700">
        Send runs recorded offline or before Fluxtrail as CSV or XLSX. Long layout: one row per measurement with the columns serial, product, lot, station,
        startedAt, finishedAt, operatorBadge, programVersion, characteristic, value, unit. Wide layout: one row per run with the same run columns and a
        column per characteristic, headed by its code and unit in square brackets, e.g. <span className="figures">bemf.ke [V/krpm]</span>. Times are
        ISO 8601 with an offset, e.g. <span className="figures">2026-12-01T08:15:00+01:00</span>. The dry run stores nothing.
      </p>
      <UploadForm onChecked={setSelected} />
      {selected !== undefined ? <UploadReport id={selected} /> : null}
      <section aria-label="Earlier uploads">
        <h3 className="mb-2 font-semibold">Earlier uploads</h3>
        {uploads.isPending ? <Spinner /> : uploads.error ? <ErrorNote error={uploads.error} title="Could not list uploads" /> : uploads.data.length === 0 ? (
          <EmptyState title="No uploads yet" />
        ) : (
          <ul className="divide-y divide-paper-200 text-sm">
            {uploads.data.map((u) => (
              <li key={u.id}>
                <button type="button" className="w-full py-1.5 text-left hover:bg-paper-100" onClick={() => setSelected(u.id)}>
                  {u.fileName} · {u.status} · {u.runs.stored} stored, {u.runs.invalid} invalid · {u.uploadedBy}, {formatDateTime(u.createdAt)}
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
