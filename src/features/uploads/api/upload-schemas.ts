import { z } from 'zod';

export const uploadsApiBase = '/api/v1/uploads';

const statusSchema = z.enum(['checking', 'dry-run', 'committing', 'committed', 'failed']);
export type UploadStatus = z.infer<typeof statusSchema>;

export const uploadSummarySchema = z.object({
  id: z.number(),
  fileName: z.string(),
  fileSha256: z.string(),
  fileType: z.enum(['csv', 'xlsx']),
  format: z.enum(['long', 'wide']),
  delimiter: z.string(),
  decimal: z.string(),
  status: statusSchema,
  progress: z.number(),
  error: z.string().nullable(),
  rows: z.object({ total: z.number(), ok: z.number(), failed: z.number() }),
  runs: z.object({ new: z.number(), stored: z.number(), duplicate: z.number(), invalid: z.number() }),
  uploadedBy: z.string(),
  createdAt: z.string(),
  checkedAt: z.string().nullable(),
  committedBy: z.string().nullable(),
  committedAt: z.string().nullable(),
});
export type UploadSummary = z.infer<typeof uploadSummarySchema>;

export const uploadProblemSchema = z.object({ row: z.number(), column: z.string(), message: z.string() });
export type UploadProblem = z.infer<typeof uploadProblemSchema>;

export const uploadRunSchema = z.object({
  firstRow: z.number(), lastRow: z.number(), serial: z.string().nullable(), station: z.string().nullable(), startedAt: z.string().nullable(),
  outcome: z.enum(['new', 'stored', 'duplicate', 'invalid']), verdict: z.enum(['pass', 'fail']).nullable(), runId: z.string().nullable(),
});
export type UploadRun = z.infer<typeof uploadRunSchema>;

export const uploadReportSchema = uploadSummarySchema.extend({
  problemsTotal: z.number(),
  problems: z.array(uploadProblemSchema),
  runList: z.array(uploadRunSchema),
});
export type UploadReport = z.infer<typeof uploadReportSchema>;

/** A pass is under way on the server: the report is polled until it ends. */
export const isBusy = (status: UploadStatus) => status === 'checking' || status === 'committing';
