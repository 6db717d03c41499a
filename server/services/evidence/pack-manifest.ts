import type { PackFilter } from './pack-filter.js';
import type { PackTotals } from './pack-scope.js';
import type { PackOrigin } from './workbook/pack-context.js';
import { csvInjectionNote } from './safe-text.js';

export type PackedFile = { name: string; bytes: number; sha256: string };

export const manifestName = 'manifest.json';

/** The pack's table of contents: what was asked for, by whom, what it holds and each file's SHA-256. */
export function buildManifest(origin: PackOrigin, filter: PackFilter, totals: PackTotals, csvRows: number, files: PackedFile[]) {
  return {
    kind: 'fluxtrail-evidence-pack',
    manifestVersion: 1,
    packId: origin.packId,
    madeBy: { name: origin.requestedBy, role: origin.requestedRole },
    requestedAt: origin.requestedAt.toISOString(),
    fluxtrailVersion: origin.version,
    filter,
    counts: {
      motors: totals.motors,
      testRuns: totals.runs,
      measurements: totals.measurements,
      csvRows,
      motorsByStatus: totals.motorStatus,
      runsByVerdict: totals.runVerdicts,
      products: totals.products.map((p) => p.code),
    },
    files,
    notes: {
      hashes: 'SHA-256 in lower-case hex over each file\'s exact bytes. The zip itself is hashed by Fluxtrail and shown with the pack.',
      csvInjection: csvInjectionNote,
      workbookText: 'Characters a workbook cannot hold as they are (control characters other than tab and line feed, carriage return, U+FFFE, U+FFFF) '
        + 'are written in the workbook as _xHHHH_ (ECMA-376 ST_Xstring), which Excel reads back as the character; the CSV holds every text exactly as stored.',
      times: 'All times are UTC.',
      retention: 'Keep this pack with the records it evidences for the retention period required by the customer and by IATF 16949 §7.5.3.2.1.',
    },
  };
}
