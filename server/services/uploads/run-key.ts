import { createHash } from 'node:crypto';

/**
 * The runId of an uploaded run, derived from what identifies a run on the floor (serial, start
 * instant, station) and nothing about the file, so the same run uploaded again in another file or
 * layout gets the same id and ingest stores it once. SHA-256 shaped as a version-5-style UUID.
 * The start is taken as an instant, so 08:15+01:00 and 07:15Z name the same run.
 */
export function uploadRunId(serial: string, startedAt: string, station: string): string {
  const instant = Date.parse(startedAt);
  const start = Number.isNaN(instant) ? startedAt.trim() : new Date(instant).toISOString();
  const bytes = createHash('sha256').update(['fluxtrail-upload-run', serial.trim(), start, station.trim()].join('\u0000')).digest().subarray(0, 16);
  bytes[6] = (bytes[6] & 0x0f) | 0x50;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = bytes.toString('hex');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
