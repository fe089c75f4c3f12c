import { Router, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import type { DataSource } from 'typeorm';
import {
  attachmentTargetSchema, MAX_ATTACHMENT_BYTES, MAX_ATTACHMENTS_PER_REQUEST, type AttachmentTarget,
} from '@shared/files/attachment.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { AppError } from '../../lib/app-error';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import type { AuthRateLimits } from '../../auth/rate-limit';
import type { FileStorage } from '../../files/storage';
import { inlineDisposition } from '../../files/inspect';
import {
  assertCanAttach, createAttachments, deleteAttachment, listAttachments, readAttachmentFile, readAttachmentThumbnail, type FileBytes,
} from './attachment.service';

const MB = MAX_ATTACHMENT_BYTES / (1024 * 1024);

/**
 * The form holds the files and nothing else (the target is in the query). Every multer limit is
 * set, so a request cannot make the server hold more than the files themselves. One part more
 * than files, so an eleventh file is refused as a file too many.
 */
const LIMITS: multer.Options['limits'] & { fieldNestingDepth: number; fieldArrayIndexLimit: number } = {
  fileSize: MAX_ATTACHMENT_BYTES,
  files: MAX_ATTACHMENTS_PER_REQUEST,
  fields: 0,
  fieldNameSize: 50,
  fieldSize: 0,
  parts: MAX_ATTACHMENTS_PER_REQUEST + 1,
  headerPairs: 20,
  fieldNestingDepth: 0,
  fieldArrayIndexLimit: 0,
};

/** Private: only the signed-in reader's browser keeps a copy, for an hour (our own choice). */
const CACHE_CONTROL = 'private, max-age=3600';

/** Multer's refusals, in the API's words: limits are 413, a malformed form 400. */
function uploadError(err: unknown): AppError {
  const code = err instanceof multer.MulterError ? err.code : undefined;
  switch (code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError('payload_too_large', `Each file may be at most ${MB} MB.`);
    case 'LIMIT_FILE_COUNT':
      return new AppError('payload_too_large', `Send at most ${MAX_ATTACHMENTS_PER_REQUEST} files at a time.`);
    case 'LIMIT_PART_COUNT':
      return new AppError('payload_too_large', `The form has too many parts: send at most ${MAX_ATTACHMENTS_PER_REQUEST} files and nothing else.`);
    case 'LIMIT_UNEXPECTED_FILE':
      return new AppError('validation_failed', 'Some fields need attention.', { files: ['Send the files in the field named "files"'] });
    case 'LIMIT_FIELD_COUNT':
      return new AppError('validation_failed', 'The form carries only the files: send targetType and targetId in the query string.');
    default:
      return new AppError('validation_failed', 'The upload was not a well-formed form. Send the files as multipart/form-data.');
  }
}

function receiveFiles(): RequestHandler {
  const receive = multer({ storage: multer.memoryStorage(), limits: LIMITS, defParamCharset: 'utf8' } as multer.Options).array('files');
  return (req, res, next) => {
    receive(req, res, (err?: unknown) => next(err ? uploadError(err) : undefined));
  };
}

function sendFile(res: Response, file: FileBytes) {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', inlineDisposition(file.fileName));
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', CACHE_CONTROL);
  res.send(file.bytes);
}

/**
 * Routes under /api/attachments: photos and PDFs on tread readings, runs, setups and events.
 * Without a storage (not configured) uploading, reading a file and deleting answer 503; the list still answers.
 */
export function attachmentRoutes(ds: DataSource, storage: FileStorage | undefined, limits: Pick<AuthRateLimits, 'beforeUpload'>) {
  const router = Router();
  router.use(requireAuth);
  const attachmentParam = idParam('attachmentId');
  const store = (): FileStorage => {
    if (!storage) throw new AppError('unavailable', 'File uploads are not set up on this server.');
    return storage;
  };

  // The count comes first: a flood of uploads is refused before its bodies are read.
  const counted: RequestHandler = (req, _res, next) => {
    limits.beforeUpload(currentUser(req).id).then(() => next(), next);
  };
  // Then the target, named in the query: someone who may not add files to it is refused before
  // multer reads a byte of them.
  const writableTarget: RequestHandler = (req, res, next) => {
    store(); // not set up: 503 before the files are read, too
    assertCanAttach(ds, currentUser(req), parsed<AttachmentTarget>(res, 'query')).then(() => next(), next);
  };
  router.post('/', counted, validate({ query: attachmentTargetSchema }), writableTarget, receiveFiles(), async (req, res) => {
    const received = (req.files as Express.Multer.File[] | undefined) ?? [];
    const files = received.map((f) => ({ originalName: f.originalname, bytes: f.buffer }));
    const items = await createAttachments(ds, store(), currentUser(req), parsed<AttachmentTarget>(res, 'query'), files);
    res.status(201).json(list(items));
  });
  router.get('/', validate({ query: attachmentTargetSchema }), async (req, res) => {
    res.json(list(await listAttachments(ds, currentUser(req), parsed<AttachmentTarget>(res, 'query'))));
  });
  router.get('/:attachmentId/file', validate({ params: attachmentParam }), async (req, res) => {
    const { attachmentId } = parsed<{ attachmentId: string }>(res, 'params');
    sendFile(res, await readAttachmentFile(ds, store(), currentUser(req), attachmentId));
  });
  router.get('/:attachmentId/thumbnail', validate({ params: attachmentParam }), async (req, res) => {
    const { attachmentId } = parsed<{ attachmentId: string }>(res, 'params');
    sendFile(res, await readAttachmentThumbnail(ds, store(), currentUser(req), attachmentId));
  });
  router.delete('/:attachmentId', validate({ params: attachmentParam }), async (req, res) => {
    const { attachmentId } = parsed<{ attachmentId: string }>(res, 'params');
    await deleteAttachment(ds, store(), currentUser(req), attachmentId);
    res.status(204).end();
  });
  return router;
}
