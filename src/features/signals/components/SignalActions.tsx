import { useState } from 'react';
import { Button } from '../../../components/Button';
import { ErrorNote } from '../../../components/ErrorNote';
import { useCan } from '../../auth/use-can';
import { useAcknowledgeSignal } from '../api/acknowledge-signal';
import { useAssignSignal } from '../api/assign-signal';
import { useCloseSignal, type Disposition } from '../api/close-signal';
import { useContainSignal } from '../api/contain-signal';
import { useEngineers } from '../api/get-engineers';
import type { SignalSummary } from '../api/signal-schemas';

const outcomes: Array<{ value: Disposition['outcome']; label: string }> = [
  { value: 'released', label: 'Motors released (holds lifted)' },
  { value: 'scrapped', label: 'Motors scrapped (holds stay)' },
  { value: 'reworked', label: 'Motors reworked (holds stay)' },
];

/** What a quality engineer can do with a signal, in the order the work happens. */
export function SignalActions({ signal }: { signal: SignalSummary }) {
  const canAct = useCan('signals:act');
  const id = String(signal.id);
  const acknowledge = useAcknowledgeSignal();
  const assign = useAssignSignal();
  const contain = useContainSignal();
  const close = useCloseSignal();
  const engineers = useEngineers();
  const [assignee, setAssignee] = useState('');
  const [note, setNote] = useState('');
  const [disposition, setDisposition] = useState<Disposition>({ cause: '', actionTaken: '', outcome: 'released' });
  if (!canAct || signal.status === 'closed') return null;
  const input = 'rounded border border-graphite-300 px-2 py-1';
  return (
    <section aria-label="Signal actions" className="space-y-4 rounded-md border border-paper-300 bg-white p-4">
      <div className="flex flex-wrap items-end gap-2">
        {signal.status === 'open' ? <Button variant="secondary" disabled={acknowledge.isPending} onClick={() => acknowledge.mutate({ id })}>Acknowledge</Button> : null}
        <label className="text-sm">Assign to
          <select aria-label="Assign to" value={assignee} onChange={(e) => setAssignee(e.target.value)} className={`ml-2 ${input}`}>
            <option value="">Choose an engineer…</option>
            {(engineers.data?.engineers ?? []).map((e) => <option key={e.subject} value={e.subject}>{e.name}</option>)}
          </select>
        </label>
        <Button variant="secondary" disabled={!assignee || assign.isPending} onClick={() => assign.mutate({ id, assignee })}>Assign</Button>
      </div>
      {signal.status === 'open' || signal.status === 'acknowledged' ? (
        <div className="flex flex-wrap items-end gap-2">
          <label className="text-sm">Containment note
            <input aria-label="Containment note" value={note} onChange={(e) => setNote(e.target.value)} className={`ml-2 w-72 ${input}`} />
          </label>
          <Button variant="danger" disabled={contain.isPending} onClick={() => contain.mutate({ id, note })}>Contain: hold affected motors</Button>
        </div>
      ) : null}
      <form className="grid gap-2 sm:grid-cols-2" onSubmit={(e) => { e.preventDefault(); close.mutate({ id, ...disposition }); }}>
        <label className="text-sm">Cause<textarea aria-label="Cause" required minLength={3} value={disposition.cause} onChange={(e) => setDisposition({ ...disposition, cause: e.target.value })} className={`block w-full ${input}`} /></label>
        <label className="text-sm">Action taken<textarea aria-label="Action taken" required minLength={3} value={disposition.actionTaken} onChange={(e) => setDisposition({ ...disposition, actionTaken: e.target.value })} className={`block w-full ${input}`} /></label>
        <label className="text-sm">Outcome
          <select aria-label="Outcome" value={disposition.outcome} onChange={(e) => setDisposition({ ...disposition, outcome: e.target.value as Disposition['outcome'] })} className={`ml-2 ${input}`}>
            {outcomes.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
          </select>
        </label>
        <div><Button type="submit" disabled={close.isPending}>Close signal</Button></div>
      </form>
      {[acknowledge.error, assign.error, contain.error, close.error].filter(Boolean).map((error, i) => <ErrorNote key={i} error={error} title="Not saved" />)}
    </section>
  );
}
