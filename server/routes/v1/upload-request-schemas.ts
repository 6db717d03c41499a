import { z } from 'zod';
import { uploadOptionsSchema } from '../../services/uploads/upload-options.js';

/** The multipart field that carries the file (multer reads it by this name). */
export const uploadFileField = 'file';

/** The multipart form of POST /api/v1/uploads: the file and how to read it (the options are the ones the route parses). */
export const uploadFormSchema = uploadOptionsSchema.extend({
  [uploadFileField]: z.file().describe('the CSV (UTF-8) or XLSX file; at most 128 MB'),
}).meta({ id: 'UploadForm' });

export const uploadIdParamSchema = z.object({ id: z.coerce.number().int().positive('id must be an upload number') });

export const uploadReportQuerySchema = z.object({
  problems: z.coerce.number().int().min(0).max(5000).default(200).describe('how many problems of the report to return, in file order'),
  runs: z.coerce.number().int().min(0).max(5000).default(200).describe('how many runs of the report to return, in file order'),
}).meta({ id: 'UploadReportQuery' });

export const uploadListQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) }).meta({ id: 'UploadListQuery' });
