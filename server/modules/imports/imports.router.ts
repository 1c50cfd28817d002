import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { commitImportInput, importKinds, importProblemsQuery, maxImportBytes, previewImportInput, type ImportProblemsQuery } from '@shared/schemas/import';
import { requirePermission } from '../../http/auth';
import { HttpError, badRequest } from '../../http/errors';
import { parseId } from '../../http/params';
import { parseOrThrow, validateBody, validateQuery } from '../../http/validate';
import { spreadsheetMediaTypes } from '../exports/spreadsheet-writer';
import { importTemplate } from './import-templates';
import { failInterruptedImports, getImport, listImportProblems, listImports, startCommit, startPreview, uploadImport, type ImportStorage } from './imports.service';
import { rejectedRowsWorkbook } from './rejected-rows';

const FILE_FIELD = 'file';
const megabytes = maxImportBytes / 1024 / 1024;

// Held in memory: the content checks, the hash and the sheet survey all read the whole file anyway.
const upload = multer({
  storage: multer.memoryStorage(),
  // Browsers send UTF-8 file names without saying so; busboy's default would read them as Latin-1.
  defParamCharset: 'utf8',
  limits: { fileSize: maxImportBytes, files: 1, fields: 5, parts: 6 },
}).single(FILE_FIELD);

const uploadFields = z.object({ kind: z.enum(importKinds, { error: `must be one of ${importKinds.join(', ')}` }) });

/** Multipart bodies go through multer; its refusals become 400 (413 for size) answers with a field message, never a 500. */
const receiveFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    throw badRequest(`Send the file as multipart/form-data in the field "${FILE_FIELD}".`, { [FILE_FIELD]: 'send the file as multipart/form-data' });
  }
  upload(req, res, (error?: unknown) => next(error === undefined ? undefined : uploadError(error)));
};

function uploadError(error: unknown): HttpError {
  if (!(error instanceof multer.MulterError)) return badRequest('The upload could not be read (malformed multipart body).', { [FILE_FIELD]: 'could not be read' });
  if (error.code === 'LIMIT_FILE_SIZE') {
    const message = `is larger than ${megabytes} MB, the most an import takes; split the sheet into several files`;
    // 413 Content Too Large (RFC 9110 §15.5.14), as the attachment upload answers.
    return new HttpError(413, 'payload_too_large', `The file cannot be imported: it ${message}.`, { [FILE_FIELD]: message });
  }
  if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_UNEXPECTED_FILE') {
    return badRequest(`Send one file, in the form field "${FILE_FIELD}".`, { [FILE_FIELD]: `send one file, in the field "${FILE_FIELD}"` });
  }
  return badRequest(`The upload could not be read: ${error.message.toLowerCase()}.`, { [FILE_FIELD]: error.message.toLowerCase() });
}

/**
 * `/api/imports`: upload (multipart `file` and `kind`), the history, one job with its progress, its
 * problems, preview and commit (both run in the background; poll the job), the rejected rows of a
 * valid-only commit, and a template per kind. Writing needs `imports:write`; reading needs `read`. The
 * original file is served by the attachments route named in the job's `fileUrl`.
 */
export function importsRouter(dataSource: DataSource, dataDir: string): Router {
  const router = Router();
  const storage: ImportStorage = { dataSource, dataDir };
  failInterruptedImports(dataSource).catch((error: unknown) => console.error('Could not mark interrupted imports as failed', error));

  router.get('/', requirePermission('read'), async (_req, res) => {
    res.json({ rows: await listImports(dataSource) });
  });

  router.post('/', requirePermission('imports:write'), receiveFile, async (req, res) => {
    const { kind } = parseOrThrow(uploadFields, req.body ?? {});
    if (!req.file) throw badRequest(`Choose a file to import, in the form field "${FILE_FIELD}".`, { [FILE_FIELD]: 'choose a file to import' });
    const job = await uploadImport(storage, req.user!, kind, { originalName: req.file.originalname, buffer: req.file.buffer });
    res.status(201).json({ job });
  });

  router.get('/templates/:file', requirePermission('read'), async (req, res) => {
    const match = /^([a-z-]+)\.xlsx$/.exec(String(req.params.file));
    const kind = importKinds.find((candidate) => candidate === match?.[1]);
    if (!kind) throw badRequest(`Templates are ${importKinds.map((name) => `${name}.xlsx`).join(', ')}.`, { kind: `must be one of ${importKinds.join(', ')}` });
    res.attachment(`kcatalog-${kind}-template.xlsx`);
    res.setHeader('Content-Type', spreadsheetMediaTypes.xlsx);
    res.send(await importTemplate(kind));
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json({ job: await getImport(dataSource, req.user!, parseId(req.params.id)) });
  });

  router.get('/:id/problems', requirePermission('read'), validateQuery(importProblemsQuery), async (req, res) => {
    res.json(await listImportProblems(dataSource, parseId(req.params.id), res.locals.query as ImportProblemsQuery));
  });

  router.post('/:id/preview', requirePermission('imports:write'), validateBody(previewImportInput), async (req, res) => {
    res.status(202).json({ job: await startPreview(storage, req.user!, parseId(req.params.id), req.body) });
  });

  router.post('/:id/commit', requirePermission('imports:write'), validateBody(commitImportInput), async (req, res) => {
    res.status(202).json({ job: await startCommit(storage, req.user!, parseId(req.params.id), req.body) });
  });

  router.get('/:id/rejected.xlsx', requirePermission('read'), async (req, res) => {
    const file = await rejectedRowsWorkbook(storage, parseId(req.params.id));
    res.attachment(file.fileName);
    res.setHeader('Content-Type', spreadsheetMediaTypes.xlsx);
    res.send(file.buffer);
  });

  return router;
}
