import { z } from 'zod';

/** Per line-to-line voltage, as the server's back-EMF analysis reports it. */
const perLine = <T extends z.ZodType>(value: T) => z.object({ uv: value, vw: value, wu: value });

/** The stored summary of a back-EMF waveform (server/services/runs/derive-back-emf.ts). */
export const backEmfSummarySchema = z.object({
  electricalHz: z.number(),
  polePairsFromFrequency: z.number(),
  cycles: z.number(),
  rmsV: perLine(z.number()),
  keVPerKrpm: z.number(),
  thdPercent: perLine(z.number()),
  unbalancePercent: z.number(),
  phaseSpacingDeg: z.object({ uvToVw: z.number(), vwToWu: z.number(), wuToUv: z.number() }),
  sequence: z.enum(['UVW', 'UWV']),
  resolver: z.object({ offsetDeg: z.number(), spreadDeg: z.number(), resolverPolePairs: z.number() }).nullable(),
});
export type BackEmfSummary = z.infer<typeof backEmfSummarySchema>;

export const insulationReadingSchema = z.object({
  resistanceMegohm: z.number(),
  windingTempC: z.number(),
  testVoltageV: z.number(),
  r30sMegohm: z.number().optional(),
  r60sMegohm: z.number().optional(),
  r1MinMegohm: z.number().optional(),
  r10MinMegohm: z.number().optional(),
});
export const hipotReadingSchema = z.object({
  voltageV: z.number(), leakageMa: z.number(), durationS: z.number(), acOrDc: z.enum(['ac', 'dc']),
});
export const windingResistanceReadingSchema = z.object({
  uOhm: z.number(), vOhm: z.number(), wOhm: z.number(), windingTempC: z.number(),
});

/** The reading of one kind from a run's readings, or undefined when absent or not that shape. */
export function readingOf<T extends z.ZodType>(readings: ReadonlyArray<{ kind: string; reading: unknown }>, kind: string, schema: T): z.infer<T> | undefined {
  const found = readings.find((r) => r.kind === kind);
  const parsed = found ? schema.safeParse(found.reading) : undefined;
  return parsed?.success ? parsed.data : undefined;
}
