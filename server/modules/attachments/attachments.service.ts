import { createHash, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import { extname, join, posix, resolve, sep } from 'node:path';
import type { DataSource } from 'typeorm';
import { attachmentExtensions, attachmentTypes, type AttachmentDto, type AttachmentExtension } from '@shared/schemas/attachment';
import { HttpError, badRequest, notFound } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { Assay } from '../assays/assay.entity';
import { recordAudit } from '../audit/record-audit';
import { Attachment } from './attachment.entity';

/** Audit entity type of attachments. */
export const attachmentAuditType = 'attachment';

/** Folder under the data folder that holds attachment files. */
const ATTACHMENT_FOLDER = 'attachments';

// Magic numbers of the binary formats: a ZIP local file header (xlsx) and an OLE2 compound file (xls).
const ZIP_MAGIC = Buffer.from([0x50, 0x4b, 0x03, 0x04]);
const OLE_MAGIC = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]);
// Some instruments write UTF-16 text, whose NUL bytes are not a sign of a binary file when a BOM says so.
const UTF16_BOMS = [Buffer.from([0xff, 0xfe]), Buffer.from([0xfe, 0xff])];
/** How much of a text file is scanned for NUL bytes. */
const TEXT_SNIFF_BYTES = 64 * 1024;

/** One file as the upload delivered it. */
export interface UploadedFile {
  originalName: string;
  content: Buffer;
}

/**
 * The file name as stored: without any folder part or control characters, at most 255 characters.
 *
 * @param name the name the browser sent
 * @returns a name safe to show and to offer in Content-Disposition
 */
export function cleanFileName(name: string): string {
  const base = name.split(/[\\/]/).pop()!.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return base.slice(-255);
}

/**
 * Checks one file against the accepted types by its extension and its content, so that a renamed binary
 * is refused: a workbook must be a ZIP (xlsx) or OLE2 (xls) container, a text export must not contain
 * NUL bytes (unless a UTF-16 byte-order mark says why).
 *
 * @param file the uploaded name and bytes
 * @returns the extension and the media type to store, or the problem in words
 */
export function checkAttachment(file: UploadedFile): { ok: true; extension: AttachmentExtension; mediaType: string } | { ok: false; problem: string } {
  const name = cleanFileName(file.originalName);
  if (name === '') return { ok: false, problem: 'has no file name' };
  const extension = extname(name).slice(1).toLowerCase();
  if (!Object.hasOwn(attachmentTypes, extension)) {
    return { ok: false, problem: `${name}: type .${extension || '(none)'} is not accepted; use ${attachmentExtensions.map((item) => `.${item}`).join(', ')}` };
  }
  if (file.content.length === 0) return { ok: false, problem: `${name} is empty` };
  const type = attachmentTypes[extension as AttachmentExtension];
  const content = file.content;
  if (type.content === 'zip' && !content.subarray(0, ZIP_MAGIC.length).equals(ZIP_MAGIC)) {
    return { ok: false, problem: `${name} is not an Excel workbook (.xlsx files are ZIP containers)` };
  }
  if (type.content === 'ole' && !content.subarray(0, OLE_MAGIC.length).equals(OLE_MAGIC)) {
    return { ok: false, problem: `${name} is not an Excel 97–2003 workbook` };
  }
  if (type.content === 'text') {
    const utf16 = UTF16_BOMS.some((bom) => content.subarray(0, 2).equals(bom));
    if (!utf16 && content.subarray(0, TEXT_SNIFF_BYTES).includes(0)) {
      return { ok: false, problem: `${name} is not a text file (it contains binary data)` };
    }
  }
  return { ok: true, extension: extension as AttachmentExtension, mediaType: type.mediaType };
}

/**
 * Attaches raw instrument files to an assay. Every file is checked first (type by extension and content);
 * one bad file refuses the whole upload. Files are stored once by content (`attachments/<ab>/<sha256>` under
 * the data folder, written to a temporary name and renamed, so a half-written file is never visible); the
 * rows and their audit events are written in one transaction. A file already attached to the assay, or
 * sent twice in one upload, is a 409. When the transaction fails, files it alone would have referenced
 * are removed again.
 *
 * @param dataSource the data source
 * @param dataDir the data folder
 * @param actorId who uploads
 * @param assayId the assay
 * @param files the uploaded files (at least one)
 * @throws {HttpError} 400 for a refused file, 404 for an unknown assay, 409 for a duplicate
 * @returns the stored attachments, in upload order
 */
export async function attachFilesToAssay(
  dataSource: DataSource,
  dataDir: string,
  actorId: number,
  assayId: number,
  files: readonly UploadedFile[],
): Promise<AttachmentDto[]> {
  if (files.length === 0) throw badRequest('Choose at least one file to attach.', { files: 'choose at least one file' });
  const fields: Record<string, string> = {};
  const accepted: { file: UploadedFile; mediaType: string }[] = [];
  files.forEach((file, index) => {
    const result = checkAttachment(file);
    if (result.ok) accepted.push({ file, mediaType: result.mediaType });
    else fields[`files.${index}`] = result.problem;
  });
  if (Object.keys(fields).length > 0) {
    throw badRequest(`The upload was refused: ${Object.values(fields).join('; ')}.`, fields);
  }
  if (!(await dataSource.getRepository(Assay).existsBy({ id: assayId }))) throw notFound('The assay');

  const prepared = accepted.map(({ file, mediaType }) => {
    const sha256 = createHash('sha256').update(file.content).digest('hex');
    return {
      content: file.content,
      originalName: cleanFileName(file.originalName),
      mediaType,
      sha256,
      storedPath: posix.join(ATTACHMENT_FOLDER, sha256.slice(0, 2), sha256),
    };
  });
  const written: string[] = [];
  for (const item of prepared) {
    const absolute = resolve(dataDir, item.storedPath);
    if (existsSync(absolute)) continue;
    await mkdir(resolve(absolute, '..'), { recursive: true });
    const temporary = `${absolute}.${randomUUID()}.part`;
    await writeFile(temporary, item.content);
    await rename(temporary, absolute);
    written.push(item.storedPath);
  }

  try {
    return await writeTransaction(dataSource, async (manager) => {
      const assay = await manager.getRepository(Assay).findOne({ where: { id: assayId }, relations: { variant: true } });
      if (!assay) throw notFound('The assay');
      const existing = await manager.getRepository(Attachment).find({ where: { ownerType: 'assay', ownerId: assayId } });
      const seen = new Map(existing.map((row) => [row.sha256, row.originalName]));
      prepared.forEach((item, index) => {
        const earlier = seen.get(item.sha256);
        if (earlier !== undefined) {
          throw new HttpError(409, 'duplicate_attachment', `${item.originalName} has the same content as ${earlier}, already attached to this assay.`, {
            [`files.${index}`]: `same content as ${earlier}`,
          });
        }
        seen.set(item.sha256, item.originalName);
      });
      const rows: Attachment[] = [];
      for (const item of prepared) {
        const row = await manager.getRepository(Attachment).save(
          manager.getRepository(Attachment).create({
            ownerType: 'assay',
            ownerId: assayId,
            originalName: item.originalName,
            mediaType: item.mediaType,
            sizeBytes: item.content.length,
            sha256: item.sha256,
            storedPath: item.storedPath,
            createdById: actorId,
          }),
        );
        await recordAudit(manager, {
          actorId,
          entityType: attachmentAuditType,
          entityId: row.id,
          campaignId: assay.variant.campaignId,
          action: 'create',
          after: { id: row.id, assayId, originalName: row.originalName, mediaType: row.mediaType, sizeBytes: row.sizeBytes, sha256: row.sha256 },
        });
        rows.push(row);
      }
      return rows.map(toAttachmentDto);
    });
  } catch (error) {
    await removeUnreferenced(dataSource, dataDir, written);
    throw error;
  }
}

/**
 * The files attached to an assay, oldest first; 404 when there is no such assay.
 *
 * @param dataSource the data source
 * @param assayId the assay
 * @returns the attachments
 */
export async function listAssayAttachments(dataSource: DataSource, assayId: number): Promise<AttachmentDto[]> {
  if (!(await dataSource.getRepository(Assay).existsBy({ id: assayId }))) throw notFound('The assay');
  const rows = await dataSource.getRepository(Attachment).find({ where: { ownerType: 'assay', ownerId: assayId }, order: { id: 'ASC' } });
  return rows.map(toAttachmentDto);
}

/**
 * Where an attachment's bytes are and how to serve them; 404 when the row or its file is missing.
 *
 * @param dataSource the data source
 * @param dataDir the data folder
 * @param id the attachment id
 * @returns the absolute path, the media type and the original name
 */
export async function getAttachmentFile(
  dataSource: DataSource,
  dataDir: string,
  id: number,
): Promise<{ absolutePath: string; mediaType: string; originalName: string }> {
  const row = await dataSource.getRepository(Attachment).findOneBy({ id });
  if (!row) throw notFound('The attachment');
  const root = resolve(dataDir);
  const absolutePath = resolve(root, row.storedPath);
  // Stored paths are written by this module only; the check keeps a tampered row from reading outside.
  if (!absolutePath.startsWith(root + sep) || !existsSync(absolutePath)) throw notFound("The attachment's file");
  return { absolutePath, mediaType: row.mediaType, originalName: row.originalName };
}

async function removeUnreferenced(dataSource: DataSource, dataDir: string, storedPaths: readonly string[]): Promise<void> {
  for (const storedPath of storedPaths) {
    const referenced = await dataSource.getRepository(Attachment).existsBy({ storedPath });
    if (!referenced) await rm(join(dataDir, storedPath), { force: true });
  }
}

function toAttachmentDto(row: Attachment): AttachmentDto {
  return {
    id: row.id,
    ownerType: row.ownerType,
    ownerId: row.ownerId,
    originalName: row.originalName,
    mediaType: row.mediaType,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    createdById: row.createdById,
    createdAt: row.createdAt.toISOString(),
    contentUrl: `/api/attachments/${row.id}/content`,
  };
}
