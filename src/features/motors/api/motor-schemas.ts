import { z } from 'zod';

/** A motor's release status as the server derives it from its latest run and its holds. */
export const motorStatusSchema = z.enum(['passed', 'failed', 'on hold', 'not tested']);
export type MotorStatus = z.infer<typeof motorStatusSchema>;

export const stepVerdictSchema = z.enum(['pass', 'fail']);

export const measurementSchema = z.object({
  characteristic: z.string(),
  name: z.string(),
  unit: z.string().nullish(),
  testStep: z.string().nullish(),
  value: z.number(),
  lsl: z.number().nullish(),
  nominal: z.number().nullish(),
  usl: z.number().nullish(),
  verdict: stepVerdictSchema,
});
export type Measurement = z.infer<typeof measurementSchema>;

export const waveformSchema = z.object({
  kind: z.string(),
  summary: z.unknown(),
});
export type Waveform = z.infer<typeof waveformSchema>;

export const runSchema = z.object({
  runId: z.string(),
  attempt: z.number(),
  verdict: stepVerdictSchema,
  startedAt: z.string(),
  finishedAt: z.string(),
  station: z.object({ code: z.string(), line: z.string() }),
  operatorBadge: z.string(),
  programVersion: z.string(),
  limitRevision: z.union([z.string(), z.number()]).nullish(),
  calibrationOk: z.boolean(),
  calibrationDue: z.string(),
  results: z.array(measurementSchema),
  waveforms: z.array(waveformSchema).default([]),
  /** Raw readings as the stand posted them (insulation, hipot, winding resistance). */
  readings: z.array(z.object({ kind: z.string(), reading: z.unknown() })).default([]),
});
export type TestRun = z.infer<typeof runSchema>;

export const holdSchema = z.object({
  id: z.number(),
  target: z.discriminatedUnion('type', [
    z.object({ type: z.literal('motor'), serial: z.string() }),
    z.object({ type: z.literal('lot'), code: z.string() }),
  ]),
  kind: z.string(),
  reason: z.string(),
  placedBy: z.string(),
  placedAt: z.string(),
  releasedBy: z.string().nullish(),
  releasedAt: z.string().nullish(),
  releaseReason: z.string().nullish(),
});
export type Hold = z.infer<typeof holdSchema>;

export const reworkNoteSchema = z.object({
  id: z.number(),
  action: z.enum(['rework', 'retest']),
  note: z.string(),
  recordedBy: z.string(),
  recordedAt: z.string(),
});
export type ReworkNote = z.infer<typeof reworkNoteSchema>;

export const auditEventSchema = z.object({
  id: z.number(),
  occurredAt: z.string(),
  actor: z.string(),
  actorRole: z.string().nullish(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string(),
  reason: z.string().nullish(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const motorRecordSchema = z.object({
  serial: z.string(),
  product: z.object({ code: z.string(), name: z.string(), motorKind: z.string() }),
  lot: z.object({
    code: z.string(),
    components: z.array(z.object({ kind: z.string(), supplierLotCode: z.string(), supplier: z.string().nullish() })),
  }),
  status: motorStatusSchema,
  holds: z.array(holdSchema),
  reworkNotes: z.array(reworkNoteSchema),
  runs: z.array(runSchema),
  auditEvents: z.array(auditEventSchema),
});
export type MotorRecord = z.infer<typeof motorRecordSchema>;

export const isActiveHold = (hold: Hold) => !hold.releasedAt;
