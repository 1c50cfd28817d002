import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import type { DataSource } from 'typeorm';
import { createCatalyticSiteInput, createEnzymeInput, fastaTextInput, maxFastaBytes, updateEnzymeInput } from '@shared/schemas/enzyme';
import { requirePermission } from '../../http/auth';
import { HttpError, badRequest, payloadTooLarge } from '../../http/errors';
import { parseId } from '../../http/params';
import { parseOrThrow, validateBody } from '../../http/validate';
import { addSite, createEnzyme, deleteSite, getEnzyme, listEnzymes, listSites, readFastaText, readFastaUpload, updateEnzyme } from './enzymes.service';

// One file in the field `file`, held in memory: FASTA files of enzymes are a few kilobytes.
const fastaUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: maxFastaBytes, files: 1, fields: 5, parts: 6 },
}).single('file');

/** Multipart bodies go through multer; its refusals become 400/413 answers instead of a 500. */
const receiveFastaFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) return next();
  fastaUpload(req, res, (error?: unknown) => next(error === undefined ? undefined : uploadError(error)));
};

function uploadError(error: unknown): HttpError {
  if (!(error instanceof multer.MulterError)) {
    return badRequest('The upload could not be read (malformed multipart body).', { file: 'could not be read' });
  }
  if (error.code === 'LIMIT_FILE_SIZE') return payloadTooLarge(`The file is larger than ${maxFastaBytes / 1_048_576} MB.`);
  if (error.code === 'LIMIT_UNEXPECTED_FILE' || error.code === 'LIMIT_FILE_COUNT') {
    return badRequest('Upload one file, in the form field "file".', { file: 'upload one file in the field "file"' });
  }
  return badRequest(`The upload could not be read: ${error.message.toLowerCase()}.`, { file: error.message.toLowerCase() });
}

/** `/api/enzymes`: parent enzymes, their catalytic sites, and FASTA reading for the enzyme form. */
export function enzymesRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('read'), async (_req, res) => {
    res.json(await listEnzymes(dataSource));
  });

  router.post('/', requirePermission('variants:write'), validateBody(createEnzymeInput), async (req, res) => {
    res.status(201).json(await createEnzyme(dataSource, req.user!.id, req.body));
  });

  // Reads a FASTA file (multipart field `file`) or text (`{ fasta }` as JSON) and returns every record.
  router.post('/fasta', requirePermission('variants:write'), receiveFastaFile, (req, res) => {
    const records = req.file
      ? readFastaUpload(req.file.buffer, 'file')
      : readFastaText(parseOrThrow(fastaTextInput, req.body ?? {}).fasta, 'fasta');
    res.json({ records });
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json(await getEnzyme(dataSource, parseId(req.params.id)));
  });

  router.patch('/:id', requirePermission('variants:write'), validateBody(updateEnzymeInput), async (req, res) => {
    res.json(await updateEnzyme(dataSource, req.user!.id, parseId(req.params.id), req.body));
  });

  router.get('/:id/sites', requirePermission('read'), async (req, res) => {
    res.json(await listSites(dataSource, parseId(req.params.id)));
  });

  router.post('/:id/sites', requirePermission('variants:write'), validateBody(createCatalyticSiteInput), async (req, res) => {
    res.status(201).json(await addSite(dataSource, req.user!.id, parseId(req.params.id), req.body));
  });

  router.delete('/:id/sites/:siteId', requirePermission('variants:write'), async (req, res) => {
    await deleteSite(dataSource, req.user!.id, parseId(req.params.id), parseId(req.params.siteId, 'siteId'));
    res.status(204).end();
  });

  return router;
}
