import { useCallback, useState } from 'react';
import { z } from 'zod';
import type { Decision } from '../components/scan/release-decision';

export type ScanOutcome = Decision | 'not found';

const recentScanSchema = z.object({
  serial: z.string(),
  outcome: z.enum(['may ship', 'must not ship', 'on hold', 'not tested', 'not found']),
  scannedAt: z.string(),
});
export type RecentScan = z.infer<typeof recentScanSchema>;

// sessionStorage: the list belongs to this tab's shift and is gone when the tablet's browser closes.
const storageKey = 'fluxtrail.scan.recent';
const keep = 30;

function load(): RecentScan[] {
  try {
    const parsed = z.array(recentScanSchema).safeParse(JSON.parse(sessionStorage.getItem(storageKey) ?? '[]'));
    return parsed.success ? parsed.data : [];
  } catch {
    return [];
  }
}

/** The last scans in this browser session, newest first. */
export function useRecentScans() {
  const [scans, setScans] = useState<RecentScan[]>(load);

  const remember = useCallback((serial: string, outcome: ScanOutcome) => {
    setScans((previous) => {
      const next = [{ serial, outcome, scannedAt: new Date().toISOString() }, ...previous].slice(0, keep);
      sessionStorage.setItem(storageKey, JSON.stringify(next));
      return next;
    });
  }, []);

  return { scans, remember };
}
