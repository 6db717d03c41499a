import { z } from 'zod';
import { backEmfWaveformSchema, oncePerKind, readingSchema } from './raw-data.js';

/**
 * The document a test stand posts once per run, and the answer it gets back. Objects are strict:
 * a field the stand sends that we do not know is refused by name rather than silently dropped.
 */
const code = (what: string) => z.string().trim().min(1, `${what} must not be empty`).max(64);
const isoWithOffset = z.iso.datetime({ offset: true, error: 'must be an ISO 8601 date-time with an offset, e.g. 2026-12-01T08:15:00+01:00' });

export const resultInputSchema = z.strictObject({
  characteristic: code('characteristic'),
  value: z.number({ error: 'must be a finite number' }),
  unit: z.string().trim().min(1).max(32),
});

export const testRunDocumentSchema = z.strictObject({
  runId: z.uuid({ error: 'must be a UUID chosen by the stand' }),
  serial: z.string().trim().min(1).max(64),
  product: code('product'),
  station: code('station'),
  lot: code('lot'),
  startedAt: isoWithOffset,
  finishedAt: isoWithOffset,
  operatorBadge: z.string().trim().min(1).max(64),
  programVersion: z.string().trim().min(1).max(64),
  results: z.array(resultInputSchema).min(1, 'a run carries at least one result').max(500),
  waveforms: oncePerKind(backEmfWaveformSchema, 4).optional(),
  readings: oncePerKind(readingSchema, 8).optional(),
}).superRefine((doc, ctx) => {
  const firstIndex = new Map<string, number>();
  doc.results.forEach((result, index) => {
    const earlier = firstIndex.get(result.characteristic);
    if (earlier === undefined) firstIndex.set(result.characteristic, index);
    else ctx.addIssue({ code: 'custom', path: ['results', index, 'characteristic'], message: `${result.characteristic} is already reported in results[${earlier}]` });
  });
}).meta({ id: 'TestRunDocument' });

export type TestRunDocument = z.infer<typeof testRunDocumentSchema>;
export type ResultInput = z.infer<typeof resultInputSchema>;

export const verdictSchema = z.enum(['pass', 'fail']);
export type Verdict = z.infer<typeof verdictSchema>;

export const judgedResultSchema = z.object({
  characteristic: z.string(),
  value: z.number(),
  unit: z.string(),
  lsl: z.number().nullable(),
  usl: z.number().nullable(),
  verdict: verdictSchema,
});
export type JudgedResult = z.infer<typeof judgedResultSchema>;

export const testRunResponseSchema = z.object({
  runId: z.uuid(),
  serial: z.string(),
  attempt: z.number().int().min(1),
  verdict: verdictSchema,
  limitRevision: z.number().int(),
  results: z.array(judgedResultSchema),
}).meta({ id: 'TestRunResponse' });
export type TestRunResponse = z.infer<typeof testRunResponseSchema>;
