import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { AppDeps } from '../../app.js';
import { currentUser, requirePermission } from '../../auth/principal.js';
import { badRequest, payloadTooLarge } from '../../errors.js';
import { uploadOptionsSchema } from '../../services/uploads/upload-options.js';
import { receiveUpload } from '../../services/uploads/receive-upload.js';
import { commitUpload } from '../../services/uploads/commit-upload.js';
import { getUpload, listUploads } from '../../services/uploads/upload-view.js';
import { actorOf } from './actor.js';
import { uploadFileField, uploadIdParamSchema, uploadListQuerySchema, uploadReportQuerySchema } from './upload-request-schemas.js';

/** A CSV of a million long-format rows is about 100 MB; larger files are split by the plant. */
const MAX_FILE_BYTES = 128 * 1024 * 1024;


/** One file field; multer's own errors become our error model instead of a 500. */
function oneFile(): RequestHandler {
  const single = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_FILE_BYTES, files: 1 } }).single(uploadFileField);
  return (req, res, next) => single(req, res, (error: unknown) => {
    if (!error) return next();
    if (error instanceof multer.MulterError && error.code === 'LIMIT_FILE_SIZE') return next(payloadTooLarge(`The file is larger than ${MAX_FILE_BYTES / 1024 / 1024} MB; split it into several uploads.`));
    if (error instanceof multer.MulterError) return next(badRequest(`The upload is not a single file in the field '${uploadFileField}' (${error.message}).`, [{ field: error.field ?? uploadFileField, message: error.message }]));
    next(error);
  });
}

/** Result uploads: a dry run of a CSV or XLSX file, its report, and the commit of its valid runs. */
export function uploadsRouter({ db, config }: AppDeps) {
  const router = Router();
  const allowed = requirePermission('uploads:commit');

  router.post('/', allowed, oneFile(), async (req, res) => {
    if (!req.file) throw badRequest(`Send the file as multipart form data in the field '${uploadFileField}'.`, [{ field: uploadFileField, message: 'is required' }]);
    const options = uploadOptionsSchema.parse(req.body ?? {});
    const { mode: _dryRun, ...reading } = options;
    const outcome = await receiveUpload(db, config.dataDir, currentUser(req.principal), { name: req.file.originalname, bytes: req.file.buffer }, reading);
    res.status(outcome.status).location(`/api/v1/uploads/${outcome.body.id}`).json(outcome.body);
  });

  router.get('/', allowed, async (req, res) => {
    res.json(await listUploads(db, uploadListQuerySchema.parse(req.query)));
  });

  router.get('/:id', allowed, async (req, res) => {
    const { problems, runs } = uploadReportQuerySchema.parse(req.query);
    res.json(await getUpload(db, uploadIdParamSchema.parse(req.params).id, { problems, runs }));
  });

  router.post('/:id/commit', allowed, async (req, res) => {
    const outcome = await commitUpload(db, config.dataDir, uploadIdParamSchema.parse(req.params).id, actorOf(req));
    res.status(outcome.status).json(outcome.body);
  });

  return router;
}
