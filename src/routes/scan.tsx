import { useState } from 'react';
import { ErrorNote } from '../components/ErrorNote';
import { StatusShape } from '../components/StatusShape';
import { LoadingScreen } from '../components/Spinner';
import { useCan } from '../features/auth/use-can';
import { useMotor } from '../features/motors/api/get-motor';
import { CameraScanButton } from '../features/motors/components/scan/CameraScanButton';
import { RecentScans } from '../features/motors/components/scan/RecentScans';
import { ScanAnswer } from '../features/motors/components/scan/ScanAnswer';
import { SerialScanField } from '../features/motors/components/scan/SerialScanField';
import { useRecentScans } from '../features/motors/hooks/use-recent-scans';
import { useScanLookup, type ScanState } from '../features/motors/hooks/use-scan-lookup';

function SerialNotFound({ serial }: { serial: string }) {
  return (
    <section aria-label="Release decision" data-decision="not found" className="rounded-lg border-4 border-dashed border-graphite-400 bg-paper-50 px-6 py-5">
      <p className="flex items-center gap-4">
        <StatusShape kind="none" className="h-16 w-16 text-graphite-400" />
        <span role="status" className="text-5xl font-bold tracking-wide text-graphite-800">
          Serial not found
        </span>
      </p>
      <p className="mt-3 text-2xl text-graphite-800">
        No motor <span className="figures font-semibold">{serial}</span> is on record. Check the label and scan again; if the
        label is right, set the motor aside and call quality.
      </p>
    </section>
  );
}

function FoundMotor({ serial, onDialogClosed }: { serial: string; onDialogClosed: () => void }) {
  // Reads the record the lookup just fetched; it refreshes by itself after a rework note is saved.
  const { data } = useMotor(serial, 10_000);
  const canRework = useCan('rework:record');
  const canRetest = useCan('retest:request');
  if (!data) return <LoadingScreen label="Looking up the serial…" />;
  return <ScanAnswer record={data} canRework={canRework} canRetest={canRetest} onDialogClosed={onDialogClosed} />;
}

function Answer({ state, onDialogClosed }: { state: ScanState; onDialogClosed: () => void }) {
  switch (state.kind) {
    case 'idle':
      return <p className="text-2xl text-graphite-500">Scan a motor's serial label to see whether it may ship.</p>;
    case 'looking':
      return <LoadingScreen label={`Looking up ${state.serial}…`} />;
    case 'not found':
      return <SerialNotFound serial={state.serial} />;
    case 'failed':
      return <ErrorNote error={state.error} title={`Could not look up ${state.serial}`} />;
    case 'found':
      return <FoundMotor serial={state.serial} onDialogClosed={onDialogClosed} />;
  }
}

export default function ScanRoute() {
  const { scans, remember } = useRecentScans();
  const { state, lookUp } = useScanLookup(remember);
  const [refocusCount, setRefocusCount] = useState(0);
  const answerKey = `${'scanId' in state ? state.scanId : state.kind}:${refocusCount}`;
  const scan = (serial: string) => void lookUp(serial);

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
      <div className="min-w-0 space-y-5">
        <h1 className="sr-only">Scan</h1>
        <div className="flex flex-wrap items-end gap-3">
          <div className="min-w-72 flex-1">
            <SerialScanField onScan={scan} answerKey={answerKey} busy={state.kind === 'looking'} />
          </div>
          <CameraScanButton onScan={scan} />
        </div>
        <Answer state={state} onDialogClosed={() => setRefocusCount((count) => count + 1)} />
      </div>
      <aside>
        <RecentScans scans={scans} onPick={scan} />
      </aside>
    </div>
  );
}
