import { z } from 'zod';

export const signalStatuses = ['open', 'acknowledged', 'contained', 'closed'] as const;
export type SignalStatus = (typeof signalStatuses)[number];

const stamp = z.object({ by: z.string().nullable(), at: z.string().nullable() }).nullable();

export const signalSummarySchema = z.object({
  id: z.number(), status: z.enum(signalStatuses), rule: z.string(), ruleText: z.string(),
  product: z.string(), characteristicId: z.number(), characteristic: z.string(), characteristicName: z.string(), unit: z.string(), lot: z.string(),
  firstRunId: z.number(), patternFirstRunId: z.number(),
  assignee: z.object({ subject: z.string(), name: z.string().nullable() }).nullable(),
  openedAt: z.string(), acknowledged: stamp, contained: stamp,
  closed: z.object({ by: z.string().nullable(), at: z.string().nullable(), cause: z.string().nullable(), actionTaken: z.string().nullable(), outcome: z.string().nullable() }).nullable(),
});
export type SignalSummary = z.infer<typeof signalSummarySchema>;

export const signalListSchema = z.object({
  signals: z.array(signalSummarySchema),
  counts: z.record(z.string(), z.number()),
});

export const signalDetailSchema = z.object({
  signal: signalSummarySchema,
  episode: z.object({ runIds: z.array(z.number()), patternFirstRunId: z.number(), lastRunId: z.number() }),
  limits: z.object({ centre: z.number(), ucl: z.number(), lcl: z.number(), status: z.string(), chartKind: z.string() }),
  series: z.array(z.object({ runId: z.number(), value: z.number() })),
  lots: z.array(z.string()),
  motors: z.array(z.object({ id: z.number(), serial: z.string(), lot: z.string(), status: z.string(), heldBySignal: z.boolean() })),
});
export type SignalDetail = z.infer<typeof signalDetailSchema>;
