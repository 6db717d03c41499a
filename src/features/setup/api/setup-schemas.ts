import { z } from 'zod';

// Response shapes of /api/v1/setup, parsed at the edge so the screens work with checked data.

export const productSchema = z.object({
  code: z.string(),
  name: z.string(),
  motorKind: z.enum(['pmsm', 'induction', 'dc']),
  polePairs: z.number(),
  resolverPolePairs: z.number().nullable(),
  ratedVoltageV: z.number(),
  ratedPowerKw: z.number(),
  ratedSpeedRpm: z.number(),
  windingMaterial: z.enum(['copper', 'aluminium']),
  windingType: z.enum(['random', 'form']),
  insulationClass: z.enum(['A', 'E', 'B', 'F', 'H', 'N', 'R']),
  serialPattern: z.string(),
  createdAt: z.string(),
});
export type Product = z.infer<typeof productSchema>;

export const characteristicSchema = z.object({
  code: z.string(),
  name: z.string(),
  unit: z.string(),
  testStep: z.string(),
  spcEnabled: z.boolean(),
  subgroupMode: z.enum(['individual', 'lot', 'consecutive']),
  subgroupSize: z.number().nullable(),
  derived: z.boolean(),
  sortOrder: z.number(),
});
export type Characteristic = z.infer<typeof characteristicSchema>;

export const limitValuesSchema = z.object({
  characteristicCode: z.string(),
  lsl: z.number().nullable(),
  nominal: z.number().nullable(),
  usl: z.number().nullable(),
});
export type LimitValues = z.infer<typeof limitValuesSchema>;

export const limitSetSchema = z.object({
  id: z.number(),
  productCode: z.string(),
  revision: z.number(),
  status: z.enum(['draft', 'approved', 'retired']),
  effectiveFrom: z.string().nullable(),
  note: z.string().nullable(),
  authoredByName: z.string(),
  authoredAt: z.string(),
  approvedByName: z.string().nullable(),
  approvedAt: z.string().nullable(),
  retiredAt: z.string().nullable(),
  limits: z.array(limitValuesSchema),
});

/** As listed: with whether it is in force now and whether the caller wrote it. */
export const limitSetViewSchema = limitSetSchema.extend({ inForce: z.boolean(), authoredByYou: z.boolean() });
export type LimitSetView = z.infer<typeof limitSetViewSchema>;

const boundsSchema = z.object({ lsl: z.number().nullable(), nominal: z.number().nullable(), usl: z.number().nullable() }).nullable();

export const differenceSchema = z.object({
  limitSetId: z.number(),
  revision: z.number(),
  status: z.enum(['draft', 'approved', 'retired']),
  comparedWithRevision: z.number().nullable(),
  changedCount: z.number(),
  rows: z.array(z.object({
    characteristicCode: z.string(),
    name: z.string(),
    unit: z.string(),
    before: boundsSchema,
    after: boundsSchema,
    change: z.enum(['added', 'removed', 'changed', 'unchanged']),
  })),
});
export type LimitDifference = z.infer<typeof differenceSchema>;

export const calibrationStates = ['valid', 'due-soon', 'expired'] as const;

export const stationSchema = z.object({
  code: z.string(),
  line: z.string(),
  kind: z.string(),
  name: z.string(),
  active: z.boolean(),
  calibrationDue: z.string(),
  calibrationState: z.enum(calibrationStates),
});
export type Station = z.infer<typeof stationSchema>;

export const calibrationSchema = z.object({
  id: z.number(),
  calibratedOn: z.string(),
  due: z.string(),
  certificate: z.string().nullable(),
  recordedBy: z.string(),
  recordedAt: z.string(),
});
export type Calibration = z.infer<typeof calibrationSchema>;

export const stationClientSchema = z.object({ clientId: z.string(), stationCode: z.string() });
export type StationClient = z.infer<typeof stationClientSchema>;

export const hipotSchema = z.object({
  productCode: z.string(),
  ratedVoltageV: z.number(),
  ratedPowerKw: z.number(),
  acVrms: z.number(),
  durationS: z.number(),
  source: z.string(),
  production: z.object({ acVrms: z.number(), durationS: z.number(), source: z.string() }),
});
export type HipotVoltage = z.infer<typeof hipotSchema>;

export const setupApiBase = '/api/v1/setup';
