import { invalid } from '../../errors.js';

/**
 * Opaque keyset cursors for the motors list: the sort key of the last row shown. Serial order
 * pages on the unique serial; time order on (last_tested_at, id), with untested motors (no time)
 * as their own block at the start (ascending) or end (descending).
 */
export type MotorCursor = { sort: 'serial'; serial: string } | { sort: 'lastTestedAt'; testedAt: string | null; id: number };

export function encodeMotorCursor(cursor: MotorCursor): string {
  return Buffer.from(JSON.stringify(cursor)).toString('base64url');
}

export function decodeMotorCursor(text: string, sort: MotorCursor['sort']): MotorCursor {
  try {
    const cursor = JSON.parse(Buffer.from(text, 'base64url').toString('utf8')) as MotorCursor;
    if (cursor.sort === sort && cursor.sort === 'serial' && typeof cursor.serial === 'string') return cursor;
    if (cursor.sort === sort && cursor.sort === 'lastTestedAt' && Number.isInteger(cursor.id)
      && (cursor.testedAt === null || !Number.isNaN(Date.parse(cursor.testedAt)))) return cursor;
  } catch {
    // Not base64 JSON: answered below like any other foreign cursor.
  }
  throw invalid([{ field: 'cursor', message: `is not a cursor of this list sorted by ${sort}; pass back nextCursor unchanged` }]);
}
