import { createHash, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { basename, extname, posix, resolve } from 'node:path';
import type { DataSource, EntityManager } from 'typeorm';
import { can, type Role } from '@shared/auth/permissions';
import { detectColumns, type RememberedMapping } from '@shared/imports/detect-columns';
import {
  runningImportStatuses,
  type CommitImportInput,
  type ImportJobDto,
  type ImportJobSummaryDto,
  type ImportKind,
  type ImportProblemDto,
  type ImportProblemsDto,
  type ImportProblemsQuery,
  type PreviewImportInput,
} from '@shared/schemas/import';
import { HttpError, badRequest, conflict, forbidden, notFound, staleVersion } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { Attachment } from '../attachments/attachment.entity';
import { cleanFileName } from '../attachments/attachments.service';
import { recordAudit } from '../audit/record-audit';
import { User } from '../users/user.entity';
import { checkUpload, importMediaTypes, reopenUpload, type CheckedUpload } from './check-upload';
import { ImportJob } from './import-job.entity';
import { ImportLookups } from './import-lookups';
import { measurementImport } from './measurement-import';
import { phSeriesImport } from './ph-series-import';
import { ratePointImport } from './rate-point-import';
import { rememberedForm, resolveMapping, type ResolvedMapping } from './resolve-mapping';
import type { RowProblem } from './row-reader';
import { ImportRolledBack, runImport, type ImportHandler, type ImportRunResult } from './run-import';
import { SavedColumnMapping } from './saved-column-mapping.entity';
import { sheetRowBatches, surveyUpload } from './sheet-reader';
import { variantImport, type HandlerOptions } from './variant-import';

/** Audit entity type of import jobs. */
export const importAuditType = 'import';

/** Where uploads are kept: the data folder, whose `attachments/` holds every stored file by content. */
export interface ImportStorage {
  dataSource: DataSource;
  dataDir: string;
}

/** Who acts. */
export interface ImportActor {
  id: number;
  role: Role;
}

// Problems a job's answer carries; the rest are paged through GET /api/imports/:id/problems.
const PROBLEMS_SHOWN = 200;
const HISTORY_SIZE = 100;
const ATTACHMENT_FOLDER = 'attachments';

// Jobs being worked on in this process, so tests and shutdown can wait for them.
const running = new WeakMap<DataSource, Set<Promise<void>>>();

/**
 * Takes an uploaded file: checks it by content (type, size, zip bomb), reads its sheets (header rows and
 * row counts, at most 200,000 data rows a sheet), keeps the file as an attachment under the data folder
 * (stored once by its SHA-256) and creates the job, waiting for a sheet and a mapping.
 *
 * @param storage data source and data folder
 * @param actor who uploads
 * @param kind what the file holds
 * @param file the original name and bytes
 * @throws {HttpError} 400 when the file is refused
 * @returns the job
 */
export async function uploadImport(storage: ImportStorage, actor: ImportActor, kind: ImportKind, file: { originalName: string; buffer: Buffer }): Promise<ImportJobDto> {
  const originalName = cleanFileName(file.originalName);
  const upload = await checkUpload({ originalName, buffer: file.buffer });
  const sheets = await surveyUpload(upload, sheetNameOfCsv(originalName));
  if (sheets.every((sheet) => sheet.headers.length === 0)) throw badRequest('The file cannot be imported: it has no rows.', { file: 'it has no rows' });
  const stored = await storeFile(storage.dataDir, file.buffer);
  const id = await writeTransaction(storage.dataSource, async (manager) => {
    const job = await manager.getRepository(ImportJob).save(
      manager.getRepository(ImportJob).create({
        kind,
        status: 'uploaded',
        attachmentId: null,
        fileName: originalName,
        format: upload.format,
        sizeBytes: file.buffer.length,
        sheets,
        sheetName: null,
        campaignId: null,
        columns: null,
        mode: null,
        problems: [],
        preview: { columns: [], rows: [] },
        seenVersions: {},
        message: null,
        createdById: actor.id,
        finishedAt: null,
      }),
    );
    const attachment = await manager.getRepository(Attachment).save(
      manager.getRepository(Attachment).create({
        ownerType: 'import',
        ownerId: job.id,
        originalName,
        mediaType: importMediaTypes[upload.format],
        sizeBytes: file.buffer.length,
        sha256: stored.sha256,
        storedPath: stored.storedPath,
        createdById: actor.id,
      }),
    );
    await manager.update(ImportJob, { id: job.id }, { attachmentId: attachment.id });
    await recordAudit(manager, {
      actorId: actor.id,
      entityType: importAuditType,
      entityId: job.id,
      action: 'create',
      after: { id: job.id, kind, fileName: originalName, sizeBytes: file.buffer.length, sha256: stored.sha256 },
    });
    return job.id;
  });
  return getImport(storage.dataSource, actor, id);
}

/**
 * One job with its sheets (each with the mapping offered to this user: the one they saved for the kind
 * where its headers are present, else detected from the headers), progress, counts, the first problems and
 * the preview.
 *
 * @param dataSource the data source
 * @param viewer who asks (whose saved mapping is offered)
 * @param id the job
 * @returns the job
 */
export async function getImport(dataSource: DataSource, viewer: { id: number }, id: number): Promise<ImportJobDto> {
  const job = await dataSource.getRepository(ImportJob).findOneBy({ id });
  if (!job) throw notFound('The import');
  const saved = await dataSource.getRepository(SavedColumnMapping).findOneBy({ userId: viewer.id, kind: job.kind });
  const creator = job.createdById === null ? null : await dataSource.getRepository(User).findOne({ where: { id: job.createdById }, select: { id: true, name: true } });
  return toJobDto(job, creator, saved?.mapping);
}

/**
 * The history: the latest jobs, newest first, with who uploaded them, when, and their counts.
 *
 * @param dataSource the data source
 * @returns the summaries
 */
export async function listImports(dataSource: DataSource): Promise<ImportJobSummaryDto[]> {
  // The problems and the preview can be large; the history does not read them.
  const jobs = await dataSource.getRepository(ImportJob).find({
    select: summaryColumns,
    order: { createdAt: 'DESC', id: 'DESC' },
    take: HISTORY_SIZE,
  });
  const creatorIds = [...new Set(jobs.map((job) => job.createdById).filter((id): id is number => id !== null))];
  const users = creatorIds.length === 0 ? [] : await dataSource.getRepository(User).find({ where: creatorIds.map((id) => ({ id })), select: { id: true, name: true } });
  const names = new Map(users.map((user) => [user.id, user]));
  return jobs.map((job) => toSummaryDto(job, job.createdById === null ? null : (names.get(job.createdById) ?? null)));
}

const summaryColumns = {
  id: true,
  kind: true,
  status: true,
  attachmentId: true,
  fileName: true,
  format: true,
  sizeBytes: true,
  sheetName: true,
  campaignId: true,
  columns: true,
  mode: true,
  rowsProcessed: true,
  rowsTotal: true,
  newRows: true,
  updatedRows: true,
  unchangedRows: true,
  invalidRows: true,
  message: true,
  createdById: true,
  finishedAt: true,
  version: true,
  createdAt: true,
  updatedAt: true,
} as const;

/**
 * A page of a job's problems, by row.
 *
 * @param dataSource the data source
 * @param id the job
 * @param query page and page size
 * @returns the page and the total
 */
export async function listImportProblems(dataSource: DataSource, id: number, query: ImportProblemsQuery): Promise<ImportProblemsDto> {
  const job = await dataSource.getRepository(ImportJob).findOne({ where: { id }, select: { id: true, problems: true } });
  if (!job) throw notFound('The import');
  const start = (query.page - 1) * query.pageSize;
  return { rows: job.problems.slice(start, start + query.pageSize), total: job.problems.length, page: query.page, pageSize: query.pageSize };
}

/**
 * Starts checking every row with a sheet and column mapping: the mapping is checked now (400 naming each
 * bad field), remembered for the user and kind, and the rows are checked in the background; the job's
 * status, progress and, at the end, its counts, problems and preview show how it goes.
 *
 * @param storage data source and data folder
 * @param actor who asks (the uploader or an admin)
 * @param id the job
 * @param input version, sheet, default campaign and columns
 * @throws {HttpError} 403 for someone else's job, 409 for a stale version or a job that is running or committed
 * @returns the job, now validating
 */
export async function startPreview(storage: ImportStorage, actor: ImportActor, id: number, input: PreviewImportInput): Promise<ImportJobDto> {
  const mapping = await writeTransaction(storage.dataSource, async (manager) => {
    const job = await editableJob(manager, actor, id, input.version);
    const resolved = await checkMapping(manager, job, input.sheet, input.columns, input.campaignId ?? null);
    await manager.update(ImportJob, { id }, {
      status: 'validating',
      sheetName: input.sheet,
      campaignId: input.campaignId ?? null,
      columns: input.columns,
      rowsProcessed: 0,
      rowsTotal: sheetOf(job, input.sheet).rowCount,
      message: null,
      finishedAt: null,
    });
    await rememberMapping(manager, actor.id, job.kind, resolved);
    return resolved;
  });
  track(storage.dataSource, previewInBackground(storage, actor.id, id, mapping));
  return getImport(storage.dataSource, actor, id);
}

/**
 * Starts writing the rows, in the background, in one transaction: all or nothing (the default), or only the
 * valid rows with the rest returned as a spreadsheet. Without sheet and columns the previewed mapping is
 * used, and a record changed since the preview refuses its row.
 *
 * @param storage data source and data folder
 * @param actor who asks (the uploader or an admin)
 * @param id the job
 * @param input version, mode, and optionally sheet, campaign and columns
 * @throws {HttpError} 400 without a mapping, 403 for someone else's job, 409 for a stale, running or committed job
 * @returns the job, now committing
 */
export async function startCommit(storage: ImportStorage, actor: ImportActor, id: number, input: CommitImportInput): Promise<ImportJobDto> {
  const plan = await writeTransaction(storage.dataSource, async (manager) => {
    const job = await editableJob(manager, actor, id, input.version);
    const usePreview = input.columns === undefined;
    if (usePreview && (job.columns === null || job.sheetName === null)) {
      throw badRequest('Choose a sheet and map the columns first (preview the import).', { columns: 'map the columns first' });
    }
    const sheet = input.sheet ?? job.sheetName!;
    const columns = input.columns ?? job.columns!;
    const campaignId = usePreview ? job.campaignId : (input.campaignId ?? null);
    const resolved = await checkMapping(manager, job, sheet, columns, campaignId);
    const seenAtPreview = usePreview && job.status === 'previewed' ? job.seenVersions : undefined;
    await manager.update(ImportJob, { id }, {
      status: 'committing',
      sheetName: sheet,
      campaignId,
      columns,
      mode: input.mode,
      rowsProcessed: 0,
      rowsTotal: sheetOf(job, sheet).rowCount,
      message: null,
      finishedAt: null,
    });
    if (!usePreview) await rememberMapping(manager, actor.id, job.kind, resolved);
    return { mapping: resolved, seenAtPreview };
  });
  track(storage.dataSource, commitInBackground(storage, actor.id, id, plan.mapping, plan.seenAtPreview));
  return getImport(storage.dataSource, actor, id);
}

/**
 * Waits until the jobs running in this process for a data source have finished (tests and shutdown).
 *
 * @param dataSource the data source
 */
export async function settleImports(dataSource: DataSource): Promise<void> {
  const jobs = running.get(dataSource);
  while (jobs && jobs.size > 0) await Promise.allSettled([...jobs]);
}

/**
 * Marks jobs that were running when the server stopped as failed: an interrupted commit was rolled back
 * with its transaction, so nothing of it was written.
 *
 * @param dataSource the data source
 */
export async function failInterruptedImports(dataSource: DataSource): Promise<void> {
  const statuses = runningImportStatuses.map((status) => `'${status}'`).join(', ');
  await dataSource.query(
    `UPDATE import_jobs SET status = 'failed', version = version + 1,
            message = 'The server stopped while this import was being worked on; nothing was written. Start it again.'
      WHERE status IN (${statuses})`,
  );
}

/**
 * The original file of a job, for the rejected-rows spreadsheet and the background work: the stored bytes,
 * checked again unless they are the bytes that passed the upload's check.
 *
 * @param storage data source and data folder
 * @param job the job
 * @returns the checked upload
 */
export async function loadUpload(storage: ImportStorage, job: ImportJob): Promise<CheckedUpload> {
  const attachment = job.attachmentId === null ? null : await storage.dataSource.getRepository(Attachment).findOneBy({ id: job.attachmentId });
  if (!attachment) throw notFound('The imported file');
  const buffer = await readFile(resolve(storage.dataDir, attachment.storedPath));
  return reopenUpload({ originalName: job.fileName, buffer }, attachment.sha256);
}

/**
 * The job's mapping resolved against its sheet's header row, as it was checked when the work started.
 *
 * @param job the job
 * @returns the resolved mapping
 */
export function storedMapping(job: ImportJob): ResolvedMapping {
  return resolveMapping(job.kind, sheetOf(job, job.sheetName ?? '').headers, job.columns ?? {}, job.campaignId !== null);
}

/**
 * The handler of an import kind.
 *
 * @param kind the kind
 * @param options manager, lookups, mapping, rows, default campaign, actor
 * @returns the handler
 */
export function handlerFor(kind: ImportKind, options: HandlerOptions): ImportHandler<unknown, unknown> {
  const handlers = { variants: variantImport, measurements: measurementImport, 'rate-points': ratePointImport, 'ph-series': phSeriesImport };
  return handlers[kind](options) as ImportHandler<unknown, unknown>;
}

async function previewInBackground(storage: ImportStorage, actorId: number, id: number, mapping: ResolvedMapping): Promise<void> {
  const { dataSource } = storage;
  try {
    const job = await dataSource.getRepository(ImportJob).findOneByOrFail({ id });
    const rows = await mappedRowBatches(storage, job, mapping);
    const lookups = await ImportLookups.load(dataSource.manager);
    const handler = handlerFor(job.kind, { manager: dataSource.manager, lookups, mapping, rows, defaultCampaignId: job.campaignId, actorId });
    const result = await runImport(handler, job.rowsTotal, {
      write: false,
      mode: 'valid-only',
      onProgress: (processed, total) => progress(dataSource.manager, id, processed, total),
    });
    await dataSource.getRepository(ImportJob).update({ id }, { status: 'previewed', ...resultColumns(result, mapping), message: null });
  } catch (error) {
    await failJob(dataSource, id, error);
  }
}

async function commitInBackground(
  storage: ImportStorage,
  actorId: number,
  id: number,
  mapping: ResolvedMapping,
  seenAtPreview: Record<string, number> | undefined,
): Promise<void> {
  const { dataSource } = storage;
  try {
    const job = await dataSource.getRepository(ImportJob).findOneByOrFail({ id });
    const mode = job.mode ?? 'all-or-nothing';
    const rows = await mappedRowBatches(storage, job, mapping);
    // The checks run inside the transaction, so they see exactly the state the writes build on. The rows are
    // checked and written batch by batch as the reader thread parses them.
    await writeTransaction(dataSource, async (manager) => {
      const lookups = await ImportLookups.load(manager);
      const handler = handlerFor(job.kind, { manager, lookups, mapping, rows, defaultCampaignId: job.campaignId, actorId });
      const result = await runImport(handler, job.rowsTotal, {
        write: true,
        mode,
        seenAtPreview,
        onProgress: (processed, total) => progress(manager, id, processed, total),
      });
      const written = result.counts.new + result.counts.updated;
      await recordAudit(manager, {
        actorId,
        entityType: importAuditType,
        entityId: id,
        action: 'commit',
        after: { id, kind: job.kind, mode, sheet: job.sheetName, counts: result.counts },
      });
      await manager.getRepository(ImportJob).update(
        { id },
        {
          status: 'committed',
          ...resultColumns(result, mapping),
          finishedAt: new Date(),
          message: `${number(written)} rows written (${number(result.counts.new)} new, ${number(result.counts.updated)} updated), ${number(result.counts.unchanged)} unchanged${result.counts.invalid > 0 ? `, ${number(result.counts.invalid)} rejected` : ''}.`,
        },
      );
    });
  } catch (error) {
    if (error instanceof ImportRolledBack) {
      await dataSource.getRepository(ImportJob).update(
        { id },
        {
          status: 'failed',
          ...resultColumns(error.result, mapping),
          // The rollback took the progress written inside the transaction with it.
          rowsProcessed: rowTotal(error.result),
          finishedAt: new Date(),
          message: `Nothing was imported: ${number(error.result.counts.invalid)} of ${number(rowTotal(error.result))} rows have problems, and the import was all or nothing. Fix them, or import only the valid rows.`,
        },
      );
      return;
    }
    await failJob(dataSource, id, error);
  }
}

async function mappedRowBatches(storage: ImportStorage, job: ImportJob, mapping: ResolvedMapping) {
  const upload = await loadUpload(storage, job);
  const columns = [...new Set([...mapping.values()].map((column) => column.column))];
  return sheetRowBatches(upload, job.sheetName ?? '', columns);
}

function number(value: number): string {
  return value.toLocaleString('en-US');
}

function rowTotal(result: ImportRunResult): number {
  return result.counts.new + result.counts.updated + result.counts.unchanged + result.counts.invalid;
}

function resultColumns(result: ImportRunResult, mapping: ResolvedMapping): Partial<ImportJob> {
  return {
    newRows: result.counts.new,
    updatedRows: result.counts.updated,
    unchangedRows: result.counts.unchanged,
    invalidRows: result.counts.invalid,
    problems: result.problems.map((problem) => withColumn(problem, mapping)),
    preview: result.preview,
    seenVersions: result.seen,
  };
}

function withColumn(problem: RowProblem, mapping: ResolvedMapping): ImportProblemDto {
  return { row: problem.row, column: problem.field === null ? null : (mapping.get(problem.field)?.header ?? null), field: problem.field, message: problem.message };
}

async function progress(manager: EntityManager, id: number, processed: number, total: number): Promise<void> {
  // Not an edit of the job: the version stays, so an open page's next request is not refused as stale.
  await manager.query(`UPDATE import_jobs SET rows_processed = ?, rows_total = ? WHERE id = ?`, [processed, total, id]);
}

async function failJob(dataSource: DataSource, id: number, error: unknown): Promise<void> {
  let message = 'The import stopped because of an error on the server; nothing was written. Try again, or ask an admin to look at the server log.';
  if (error instanceof HttpError) message = error.message;
  else console.error(`[import ${id}]`, error);
  await dataSource
    .getRepository(ImportJob)
    .update({ id }, { status: 'failed', message, finishedAt: new Date() })
    .catch((updateError: unknown) => console.error(`[import ${id}] could not record the failure`, updateError));
}

function track(dataSource: DataSource, work: Promise<void>): void {
  const jobs = running.get(dataSource) ?? new Set<Promise<void>>();
  running.set(dataSource, jobs);
  jobs.add(work);
  void work.finally(() => jobs.delete(work));
}

async function editableJob(manager: EntityManager, actor: ImportActor, id: number, version: number): Promise<ImportJob> {
  const job = await manager.getRepository(ImportJob).findOneBy({ id });
  if (!job) throw notFound('The import');
  if (job.createdById !== actor.id && !can(actor.role, 'users:manage')) throw forbidden('Only the person who uploaded the file, or an admin, may preview or commit this import.');
  if (job.version !== version) throw staleVersion('This import', job.version);
  if (runningImportStatuses.includes(job.status)) throw conflict('This import is being worked on; wait until it has finished.', { status: job.status });
  if (job.status === 'committed') throw conflict('This import has been committed already; upload the file again to import it once more.', { status: job.status });
  return job;
}

async function checkMapping(manager: EntityManager, job: ImportJob, sheetName: string, columns: PreviewImportInput['columns'], campaignId: number | null): Promise<ResolvedMapping> {
  const sheet = job.sheets.find((candidate) => candidate.name === sheetName);
  if (!sheet) throw badRequest(`The file has no sheet named ${sheetName}.`, { sheet: `must be one of ${job.sheets.map((candidate) => candidate.name).join(', ')}` });
  if (campaignId !== null && !(await manager.query(`SELECT 1 FROM campaigns WHERE id = ?`, [campaignId]))[0]) {
    throw badRequest(`There is no campaign with id ${campaignId}.`, { campaignId: `no campaign has id ${campaignId}` });
  }
  return resolveMapping(job.kind, sheet.headers, columns, campaignId !== null);
}

async function rememberMapping(manager: EntityManager, userId: number, kind: ImportKind, mapping: ResolvedMapping): Promise<void> {
  const repository = manager.getRepository(SavedColumnMapping);
  const saved = await repository.findOneBy({ userId, kind });
  await repository.save(saved ? Object.assign(saved, { mapping: rememberedForm(mapping) }) : repository.create({ userId, kind, mapping: rememberedForm(mapping) }));
}

function sheetOf(job: ImportJob, name: string) {
  const sheet = job.sheets.find((candidate) => candidate.name === name);
  if (!sheet) throw badRequest(`The file has no sheet named ${name}.`, { sheet: `no sheet is named ${name}` });
  return sheet;
}

function sheetNameOfCsv(fileName: string): string {
  return basename(fileName, extname(fileName)).slice(0, 100) || 'CSV';
}

async function storeFile(dataDir: string, buffer: Buffer): Promise<{ sha256: string; storedPath: string }> {
  // The attachments module's layout: one file per content under attachments/<first two hex digits>/<sha256>.
  const sha256 = createHash('sha256').update(buffer).digest('hex');
  const storedPath = posix.join(ATTACHMENT_FOLDER, sha256.slice(0, 2), sha256);
  const absolute = resolve(dataDir, storedPath);
  if (!existsSync(absolute)) {
    await mkdir(resolve(absolute, '..'), { recursive: true });
    // Written under a temporary name and renamed, so a half-written file is never visible.
    const temporary = `${absolute}.${randomUUID()}.part`;
    await writeFile(temporary, buffer);
    await rename(temporary, absolute);
  }
  return { sha256, storedPath };
}

function toJobDto(job: ImportJob, creator: { id: number; name: string } | null, remembered: RememberedMapping | undefined): ImportJobDto {
  return {
    ...toSummaryDto(job, creator),
    sheets: job.sheets.map((sheet) => ({ ...sheet, suggested: detectColumns(job.kind, sheet.headers, remembered) })),
    problemCount: job.problems.length,
    problems: job.problems.slice(0, PROBLEMS_SHOWN),
    preview: job.preview,
  };
}

function toSummaryDto(job: ImportJob, creator: { id: number; name: string } | null): ImportJobSummaryDto {
  const showRejected = job.status === 'committed' && job.mode === 'valid-only' && job.invalidRows > 0;
  return {
    id: job.id,
    kind: job.kind,
    status: job.status,
    fileName: job.fileName,
    format: job.format,
    sizeBytes: job.sizeBytes,
    fileUrl: job.attachmentId === null ? '' : `/api/attachments/${job.attachmentId}/content`,
    sheet: job.sheetName,
    campaignId: job.campaignId,
    columns: job.columns,
    mode: job.mode,
    progress: { processed: job.rowsProcessed, total: job.rowsTotal },
    counts: { new: job.newRows, updated: job.updatedRows, unchanged: job.unchangedRows, invalid: job.invalidRows },
    rejectedUrl: showRejected ? `/api/imports/${job.id}/rejected.xlsx` : null,
    message: job.message,
    createdBy: creator,
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
    finishedAt: job.finishedAt ? job.finishedAt.toISOString() : null,
    version: job.version,
  };
}
