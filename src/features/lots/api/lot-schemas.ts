import { z } from 'zod';

export const lotCountsSchema = z.object({
  motors: z.number(),
  passed: z.number(),
  failed: z.number(),
  onHold: z.number(),
  notTested: z.number(),
});
export type LotCounts = z.infer<typeof lotCountsSchema>;

export const motorStatusSchema = z.enum(['passed', 'failed', 'on hold', 'not tested']);

export const lotHoldSchema = z.object({
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
export type LotHold = z.infer<typeof lotHoldSchema>;

export const lotRecordSchema = z.object({
  code: z.string(),
  product: z.object({ code: z.string(), name: z.string() }),
  createdAt: z.string(),
  components: z.array(z.object({ kind: z.string(), supplierLotCode: z.string(), supplier: z.string().nullish() })),
  counts: lotCountsSchema,
  holds: z.array(lotHoldSchema),
  motors: z.array(
    z.object({ serial: z.string(), status: motorStatusSchema, attempts: z.number(), lastTestedAt: z.string().nullable() }),
  ),
});
export type LotRecord = z.infer<typeof lotRecordSchema>;
export type LotMotor = LotRecord['motors'][number];
