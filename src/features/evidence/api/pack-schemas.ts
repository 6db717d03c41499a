import { z } from 'zod';

export const packFilterSchema = z.object({
  serials: z.array(z.string()).optional(),
  serialFrom: z.string().optional(),
  serialTo: z.string().optional(),
  lots: z.array(z.string()).optional(),
  product: z.string().optional(),
  from: z.string().optional(),
  to: z.string().optional(),
});
export type PackFilter = z.infer<typeof packFilterSchema>;

export const packStatusSchema = z.enum(['queued', 'running', 'done', 'failed', 'cancelled']);

export const evidencePackSchema = z.object({
  id: z.number(),
  status: packStatusSchema,
  progress: z.number(),
  rows: z.number(),
  rowsTotal: z.number().nullable(),
  sha256: z.string().nullable(),
  sizeBytes: z.number().nullable(),
  error: z.string().nullable(),
  cancelRequested: z.boolean(),
  filter: packFilterSchema,
  requestedBy: z.object({ name: z.string(), role: z.string() }),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type EvidencePack = z.infer<typeof evidencePackSchema>;

export const evidencePacksQueryKey = ['evidence-packs'] as const;
