import { z } from 'zod';

/**
 * Raw data a stand may post with a run, from which Fluxtrail derives characteristics itself
 * (server/services/runs/derive-characteristics.ts). Objects are strict like the rest of the run
 * document. The sample-count limit is checked after parsing, so that an oversized waveform is
 * answered 413 rather than 422.
 */
const positive = (what: string) => z.number({ error: `${what} must be a finite number` }).positive(`${what} must be above zero`);
const nonNegative = (what: string) => z.number({ error: `${what} must be a finite number` }).min(0, `${what} must not be negative`);
const temperatureC = z.number({ error: 'must be a finite temperature in °C' }).min(-50).max(250);
const samples = z.array(z.number({ error: 'every sample must be a finite number' }));

export const backEmfWaveformSchema = z.strictObject({
  kind: z.literal('back-emf'),
  sampleRateHz: positive('sampleRateHz'),
  speedRpm: positive('speedRpm'),
  /** Line-to-line voltages in volts, sampled together. */
  lineToLineV: z.strictObject({ uv: samples, vw: samples, wu: samples }),
  /** Resolver-to-digital converter output in resolver electrical degrees, sampled with the voltages. */
  resolverAngleDeg: samples.optional(),
});
export type BackEmfWaveformInput = z.infer<typeof backEmfWaveformSchema>;

// Safety: these readings record tests that apply hazardous voltages; Fluxtrail only records and
// judges them, the site's electrical-safety procedures govern how they are taken.
export const insulationReadingSchema = z.strictObject({
  kind: z.literal('insulation'),
  /** The 1-min reading, winding to frame, at the winding temperature. */
  resistanceMegohm: nonNegative('resistanceMegohm'),
  windingTempC: temperatureC,
  testVoltageV: positive('testVoltageV'),
  r30sMegohm: positive('r30sMegohm').optional(),
  r60sMegohm: nonNegative('r60sMegohm').optional(),
  r1MinMegohm: positive('r1MinMegohm').optional(),
  r10MinMegohm: nonNegative('r10MinMegohm').optional(),
});

export const hipotReadingSchema = z.strictObject({
  kind: z.literal('hipot'),
  voltageV: positive('voltageV'),
  leakageMa: nonNegative('leakageMa'),
  durationS: positive('durationS'),
  acOrDc: z.enum(['ac', 'dc']),
});

export const windingResistanceReadingSchema = z.strictObject({
  kind: z.literal('winding-resistance'),
  uOhm: nonNegative('uOhm'),
  vOhm: nonNegative('vOhm'),
  wOhm: nonNegative('wOhm'),
  windingTempC: temperatureC,
});

export const readingSchema = z.discriminatedUnion('kind', [insulationReadingSchema, hipotReadingSchema, windingResistanceReadingSchema]);
export type ReadingInput = z.infer<typeof readingSchema>;
export type InsulationReading = z.infer<typeof insulationReadingSchema>;
export type WindingResistanceReading = z.infer<typeof windingResistanceReadingSchema>;

/** A list in which each kind appears at most once: a run stores one waveform and one reading per kind. */
export function oncePerKind<T extends z.ZodType<{ kind: string }>>(item: T, max: number) {
  return z.array(item).max(max).superRefine((items, ctx) => {
    const firstIndex = new Map<string, number>();
    items.forEach((entry, index) => {
      const earlier = firstIndex.get(entry.kind);
      if (earlier === undefined) firstIndex.set(entry.kind, index);
      else ctx.addIssue({ code: 'custom', path: [index, 'kind'], message: `${entry.kind} is already given at index ${earlier}` });
    });
  });
}
