import { StatusShape, type ShapeKind } from '../../../../components/StatusShape';
import type { RecentScan, ScanOutcome } from '../../hooks/use-recent-scans';

const looks: Record<ScanOutcome, { word: string; shape: ShapeKind; tone: string }> = {
  'may ship': { word: 'May ship', shape: 'pass', tone: 'text-pass' },
  'must not ship': { word: 'Must not ship', shape: 'fail', tone: 'text-fail' },
  'on hold': { word: 'On hold', shape: 'hold', tone: 'text-hold' },
  'not tested': { word: 'Not tested', shape: 'none', tone: 'text-graphite-500' },
  'not found': { word: 'Not found', shape: 'none', tone: 'text-graphite-400' },
};

const timeOf = (iso: string) => new Date(iso).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });

type RecentScansProps = {
  scans: RecentScan[];
  onPick: (serial: string) => void;
};

/** This shift's scans on this tablet, newest first; tapping one looks it up again. */
export function RecentScans({ scans, onPick }: RecentScansProps) {
  return (
    <section aria-labelledby="recent-scans-title" className="rounded-lg border border-paper-300 bg-white">
      <h2 id="recent-scans-title" className="border-b border-paper-300 px-4 py-3 text-lg font-semibold">
        This shift
      </h2>
      {scans.length === 0 ? (
        <p className="px-4 py-4 text-graphite-500">Scanned serials will be listed here.</p>
      ) : (
        <ul aria-label="Recent scans" className="divide-y divide-paper-200">
          {scans.map((scan) => {
            const look = looks[scan.outcome];
            return (
              <li key={scan.scannedAt + scan.serial}>
                <button
                  type="button"
                  onClick={() => onPick(scan.serial)}
                  className="flex min-h-14 w-full items-center gap-3 px-4 py-2 text-left hover:bg-paper-100"
                >
                  <StatusShape kind={look.shape} className={`h-5 w-5 ${look.tone}`} />
                  <span className="min-w-0 flex-1">
                    <span className="figures block truncate text-lg text-graphite-950">{scan.serial}</span>
                    <span className="block text-sm text-graphite-600">{look.word}</span>
                  </span>
                  <span className="figures text-sm text-graphite-500">{timeOf(scan.scannedAt)}</span>
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
