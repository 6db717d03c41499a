import { formatDateTime } from '../../../../lib/format';
import type { ReworkNote } from '../../api/motor-schemas';

const actionWords = { rework: 'Rework', retest: 'Sent to retest' } as const;

export function ReworkNoteList({ notes }: { notes: ReworkNote[] }) {
  if (notes.length === 0) return <p className="text-sm text-graphite-500">No rework or retest notes.</p>;
  return (
    <ul className="divide-y divide-paper-200 rounded-lg border border-paper-300 bg-white">
      {notes.map((note) => (
        <li key={note.id} className="px-4 py-2 text-sm">
          <p>
            <span className="font-semibold text-graphite-950">{actionWords[note.action]}</span>{' '}
            <span className="text-graphite-500">
              by {note.recordedBy}, <span className="figures">{formatDateTime(note.recordedAt)}</span>
            </span>
          </p>
          <p className="mt-0.5 whitespace-pre-line text-graphite-900">{note.note}</p>
        </li>
      ))}
    </ul>
  );
}
