import { z } from 'zod';

/**
 * The answers of the v1 record routes, for the OpenAPI document. The API tests parse real
 * responses with these schemas, so the document cannot drift from what the server sends.
 */
const verdict = z.enum(['pass', 'fail']);
const motorStatus = z.enum(['passed', 'failed', 'on hold', 'not tested']);
const limitValue = z.number().nullable();

export const errorSchema = z.object({
  error: z.object({
    code: z.string(), message: z.string(),
    fields: z.array(z.object({ field: z.string().describe('e.g. results[3].value'), message: z.string() })).optional(),
  }),
}).meta({ id: 'Error' });

export const productListSchema = z.object({
  items: z.array(z.object({ code: z.string(), name: z.string(), motorKind: z.string(), serialPattern: z.string() })),
}).meta({ id: 'ProductList' });

export const testPlanSchema = z.object({
  product: z.object({ code: z.string(), name: z.string(), motorKind: z.string(), serialPattern: z.string() }),
  limitRevision: z.number().int().nullable(),
  effectiveFrom: z.string().nullable(),
  characteristics: z.array(z.object({
    code: z.string(), name: z.string(), unit: z.string(), testStep: z.string(), derived: z.boolean(),
    lsl: limitValue, nominal: limitValue, usl: limitValue,
  })),
}).meta({ id: 'TestPlan' });

export const stationSchema = z.object({
  code: z.string(), line: z.string(), kind: z.string(), name: z.string(), calibrationDue: z.iso.date(),
}).meta({ id: 'Station' });

export const holdSchema = z.object({
  id: z.number().int(),
  target: z.union([z.object({ type: z.literal('motor'), serial: z.string() }), z.object({ type: z.literal('lot'), code: z.string() })]),
  kind: z.enum(['manual', 'calibration', 'signal']), reason: z.string(), signalId: z.number().int().nullable(),
  placedBy: z.string(), placedAt: z.string(), releasedBy: z.string().nullable(), releasedAt: z.string().nullable(), releaseReason: z.string().nullable(),
}).meta({ id: 'Hold' });

export const reworkNoteSchema = z.object({
  id: z.number().int(), action: z.enum(['rework', 'retest']), note: z.string(), recordedBy: z.string(), recordedAt: z.string(),
}).meta({ id: 'ReworkNote' });

export const motorListSchema = z.object({
  items: z.array(z.object({ serial: z.string(), product: z.string(), lot: z.string(), status: motorStatus, lastTestedAt: z.string().nullable() })),
  nextCursor: z.string().nullable().describe('pass back as cursor for the next page; null on the last page'),
}).meta({ id: 'MotorList' });

const componentSchema = z.object({ kind: z.string(), supplierLotCode: z.string(), supplier: z.string().nullable() });

export const motorRecordSchema = z.object({
  serial: z.string(),
  product: z.object({ code: z.string(), name: z.string(), motorKind: z.string() }),
  lot: z.object({ code: z.string(), components: z.array(componentSchema) }),
  status: motorStatus,
  holds: z.array(holdSchema),
  reworkNotes: z.array(reworkNoteSchema),
  runs: z.array(z.object({
    runId: z.string(), attempt: z.number().int(), verdict, startedAt: z.string(), finishedAt: z.string(),
    station: z.object({ code: z.string(), line: z.string() }), operatorBadge: z.string(), programVersion: z.string(),
    limitRevision: z.number().int().nullable(), calibrationOk: z.boolean(), calibrationDue: z.iso.date(),
    results: z.array(z.object({
      characteristic: z.string(), name: z.string(), unit: z.string(), testStep: z.string(),
      value: z.number(), lsl: limitValue, nominal: limitValue, usl: limitValue, verdict,
    })),
    waveforms: z.array(z.object({ kind: z.string(), summary: z.unknown() })),
    readings: z.array(z.object({ kind: z.string(), reading: z.unknown() })),
  })).describe('latest first'),
  auditEvents: z.array(z.object({
    id: z.number().int(), occurredAt: z.string(), actor: z.string(), actorRole: z.string().nullable(), action: z.string(),
    entityType: z.string(), entityId: z.string(), before: z.unknown(), after: z.unknown(), reason: z.string().nullable(),
  })),
}).meta({ id: 'MotorRecord' });

const lotCounts = z.object({ motors: z.number().int(), passed: z.number().int(), failed: z.number().int(), onHold: z.number().int(), notTested: z.number().int() });

export const lotListSchema = z.object({
  items: z.array(z.object({ code: z.string(), product: z.string(), createdAt: z.string(), activeHolds: z.number().int(), counts: lotCounts })),
  nextCursor: z.string().nullable(),
}).meta({ id: 'LotList' });

export const lotRecordSchema = z.object({
  code: z.string(), product: z.object({ code: z.string(), name: z.string() }), createdAt: z.string(),
  components: z.array(componentSchema), counts: lotCounts, holds: z.array(holdSchema),
  motors: z.array(z.object({ serial: z.string(), status: motorStatus, attempts: z.number().int(), lastTestedAt: z.string().nullable() })),
}).meta({ id: 'LotRecord' });
