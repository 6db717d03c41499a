import { z } from 'zod';

export const yieldGroupSchema = z.object({
  key: z.string(),
  tested: z.number(),
  passedFirst: z.number(),
  passedFinal: z.number(),
  firstPassYield: z.number().nullable(),
  finalYield: z.number().nullable(),
});
export type YieldGroup = z.infer<typeof yieldGroupSchema>;

export type YieldGrouping = 'day' | 'week' | 'shift' | 'line' | 'station' | 'product' | 'lot';

/** The board's filter as it travels to the server; empty fields are left out. */
export type YieldFilter = { from?: string; to?: string; product?: string; line?: string };
