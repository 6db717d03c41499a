import { z } from 'zod';

export const limitsSchema = z.object({
  id: z.number(),
  chartKind: z.enum(['individuals', 'xbar-s-lot', 'xbar-s-consecutive', 'ewma', 'cusum']),
  subgroupSize: z.number().nullable(),
  status: z.enum(['trial', 'frozen', 'superseded']),
  centre: z.number(), ucl: z.number(), lcl: z.number(), sigma: z.number(),
  rules: z.array(z.string()),
  baseline: z.object({ fromRunId: z.number(), toRunId: z.number(), points: z.number() }),
  computedBy: z.string(), computedAt: z.string(),
  frozenBy: z.string().nullable(), frozenAt: z.string().nullable(),
  exclusions: z.array(z.object({ runId: z.number().nullable(), lotId: z.number().nullable(), reason: z.string(), excludedBy: z.string() })),
});
export type Limits = z.infer<typeof limitsSchema>;

export const chartSchema = z.object({
  characteristic: z.object({ id: z.number(), code: z.string(), name: z.string(), unit: z.string(), product: z.string(), spcEnabled: z.boolean() }),
  limits: z.object({ trial: limitsSchema.nullable(), frozen: limitsSchema.nullable() }),
  spec: z.object({ lsl: z.number().nullable(), usl: z.number().nullable(), revision: z.number() }).nullable(),
  total: z.number(),
  sampled: z.boolean(),
  points: z.array(z.object({ runId: z.number(), value: z.number() })),
  buckets: z.array(z.object({ fromRunId: z.number(), toRunId: z.number(), min: z.number(), max: z.number(), mean: z.number(), n: z.number() })),
  violations: z.array(z.object({ runId: z.number(), value: z.number(), rule: z.string(), ruleText: z.string() })),
  /** For an EWMA chart: the smoothed statistic its limits apply to. */
  ewma: z.array(z.object({ runId: z.number(), z: z.number() })).default([]),
  signals: z.array(z.object({ id: z.number(), rule: z.string(), runId: z.number(), status: z.string(), value: z.number().nullable(), ruleText: z.string() })),
});
export type ChartData = z.infer<typeof chartSchema>;

export const characteristicListSchema = z.object({
  characteristics: z.array(z.object({
    id: z.number(), code: z.string(), name: z.string(), unit: z.string(), product: z.string(), spcEnabled: z.boolean(), limitsStatus: z.string().nullable(),
  })),
});
export type SpcCharacteristic = z.infer<typeof characteristicListSchema>['characteristics'][number];

export const capabilitySchema = z.object({
  n: z.number(),
  reason: z.string().nullable(),
  spec: z.object({ lsl: z.number().nullable(), usl: z.number().nullable() }).nullable(),
  normal: z.boolean().optional(),
  study: z.object({
    mean: z.number(), sigmaWithin: z.number(), sigmaOverall: z.number(), cp: z.number().nullable(), cpk: z.number(),
    pp: z.number().nullable(), ppk: z.number(), cpkLower95: z.number(), cpkUpper95: z.number(), ppmOutOfSpec: z.number(),
    normality: z.object({ pValue: z.number() }),
  }).nullable(),
  histogram: z.array(z.object({ from: z.number(), to: z.number(), count: z.number() })).optional(),
  curve: z.array(z.object({ x: z.number(), count: z.number() })).optional(),
});
export type CapabilityData = z.infer<typeof capabilitySchema>;

export const subgroupsSchema = z.object({
  lots: z.array(z.object({ lot: z.string(), n: z.number(), mean: z.number(), sd: z.number().nullable(), firstRunId: z.number() })),
});
