import { z } from 'zod';

/**
 * The answers of the result-upload routes, for the OpenAPI document. The upload API tests parse
 * real responses with these schemas, so the document cannot drift from what the server sends.
 */
const count = z.number().int();

export const uploadSummarySchema = z.object({
  id: z.number().int(), fileName: z.string(), fileSha256: z.string().describe('SHA-256 of the file as sent, hex'),
  fileType: z.enum(['csv', 'xlsx']), format: z.enum(['long', 'wide']), delimiter: z.string(), decimal: z.enum(['.', ',']),
  status: z.enum(['checking', 'dry-run', 'committing', 'committed', 'failed']).describe('checking and committing run in the background: poll GET /api/v1/uploads/{id}'),
  progress: z.number().min(0).max(1).describe('share of the current pass done, 0 to 1'),
  error: z.string().nullable().describe('why the last pass failed, when status is failed'),
  rows: z.object({ total: count, ok: count, failed: count }),
  runs: z.object({ new: count, stored: count, duplicate: count, invalid: count }),
  uploadedBy: z.string(), createdAt: z.string(), checkedAt: z.string().nullable(), committedBy: z.string().nullable(), committedAt: z.string().nullable(),
}).meta({ id: 'UploadSummary' });

export const uploadReportSchema = uploadSummarySchema.extend({
  problemsTotal: count,
  problems: z.array(z.object({ row: count.describe('as a spreadsheet shows it; the header is row 1'), column: z.string(), message: z.string() })),
  runList: z.array(z.object({
    firstRow: count, lastRow: count, serial: z.string().nullable(), station: z.string().nullable(), startedAt: z.string().nullable(),
    outcome: z.enum(['new', 'stored', 'duplicate', 'invalid']), verdict: z.enum(['pass', 'fail']).nullable(), runId: z.string().nullable(),
  })),
}).meta({ id: 'UploadReport' });

export const uploadListSchema = z.object({ items: z.array(uploadSummarySchema) }).meta({ id: 'UploadList' });
