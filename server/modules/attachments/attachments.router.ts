import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { DataSource } from 'typeorm';
import { attachmentField, maxAttachmentBytes, maxAttachmentsPerUpload } from '@shared/schemas/attachment';
import { requirePermission } from '../../http/auth';
import { HttpError, badRequest } from '../../http/errors';
import { parseId } from '../../http/params';
import { attachFilesToAssay, getAttachmentFile, listAssayAttachments } from './attachments.service';

const megabytes = maxAttachmentBytes / 1_048_576;

// Held in memory for the hash and the content check; the limits keep one request under 50 MB.
const attachmentUpload = multer({
  storage: multer.memoryStorage(),
  // Browsers send UTF-8 file names without saying so; busboy's default would read them as Latin-1.
  defParamCharset: 'utf8',
  limits: { fileSize: maxAttachmentBytes, files: maxAttachmentsPerUpload, fields: 5, parts: maxAttachmentsPerUpload + 5 },
}).array(attachmentField, maxAttachmentsPerUpload);

/** Multipart bodies go through multer; its refusals become 400/413 answers with a field message, never a 500. */
const receiveFiles: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    throw badRequest(`Send the files as multipart/form-data in the field "${attachmentField}".`, {
      [attachmentField]: 'send the files as multipart/form-data',
    });
  }
  attachmentUpload(req, res, (error?: unknown) => next(error === undefined ? undefined : uploadError(error)));
};

function uploadError(error: unknown): HttpError {
  if (!(error instanceof multer.MulterError)) {
    return badRequest('The upload could not be read (malformed multipart body).', { [attachmentField]: 'could not be read' });
  }
  if (error.code === 'LIMIT_FILE_SIZE') {
    return new HttpError(413, 'payload_too_large', `A file is larger than ${megabytes} MB.`, { [attachmentField]: `each file must be at most ${megabytes} MB` });
  }
  if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_UNEXPECTED_FILE') {
    return badRequest(`Attach at most ${maxAttachmentsPerUpload} files, in the form field "${attachmentField}".`, {
      [attachmentField]: `at most ${maxAttachmentsPerUpload} files, in the field "${attachmentField}"`,
    });
  }
  return badRequest(`The upload could not be read: ${error.message.toLowerCase()}.`, { [attachmentField]: error.message.toLowerCase() });
}

/**
 * Raw instrument files of assays, mounted at `/api`: `POST /assays/:id/attachments` (multipart, field
 * `files`), `GET /assays/:id/attachments` and `GET /attachments/:id/content`. Files live under `dataDir`.
 */
export function attachmentsRouter(dataSource: DataSource, dataDir: string): Router {
  const router = Router();

  router.post('/assays/:id/attachments', requirePermission('measurements:write'), receiveFiles, async (req, res) => {
    const assayId = parseId(req.params.id);
    const uploaded = (req.files as Express.Multer.File[] | undefined) ?? [];
    const files = uploaded.map((file) => ({ originalName: file.originalname, content: file.buffer }));
    res.status(201).json({ attachments: await attachFilesToAssay(dataSource, dataDir, req.user!.id, assayId, files) });
  });

  router.get('/assays/:id/attachments', requirePermission('read'), async (req, res) => {
    res.json({ attachments: await listAssayAttachments(dataSource, parseId(req.params.id)) });
  });

  router.get('/attachments/:id/content', requirePermission('read'), async (req, res) => {
    const file = await getAttachmentFile(dataSource, dataDir, parseId(req.params.id));
    // Always a download: an uploaded XML or text file is never rendered in the app's origin.
    res.attachment(file.originalName);
    res.setHeader('Content-Type', file.mediaType);
    res.sendFile(file.absolutePath);
  });

  return router;
}
