import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import type { ColumnMapping, ImportKind, ImportMode, ImportPreviewRowDto, ImportProblemDto, ImportStatus } from '@shared/schemas/import';

/** One sheet of the uploaded file as the upload found it. */
export interface StoredSheet {
  name: string;
  rowCount: number;
  headers: string[];
}

/**
 * One spreadsheet import: the uploaded file (an attachment), the sheet and column mapping chosen, where
 * the work stands with its progress, the row counts and every row's problems. Progress is written to the
 * row as the work goes, so that a reloaded page finds it.
 */
@Entity('import_jobs')
@Index('idx_import_jobs_created', ['createdAt'])
@Index('idx_import_jobs_creator_created', ['createdById', 'createdAt'])
export class ImportJob {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'varchar', length: 16 })
  kind: ImportKind;

  @Column({ type: 'varchar', length: 12 })
  status: ImportStatus;

  /** The uploaded file (owner type `import`). */
  @Column({ type: 'integer', name: 'attachment_id', nullable: true })
  attachmentId: number | null;

  @Column({ type: 'varchar', length: 255, name: 'file_name' })
  fileName: string;

  /** `xlsx` or `csv`, as read from the content. */
  @Column({ type: 'varchar', length: 4 })
  format: 'xlsx' | 'csv';

  /** Size of the upload, bytes. */
  @Column({ type: 'integer', name: 'size_bytes' })
  sizeBytes: number;

  @Column({ type: 'simple-json' })
  sheets: StoredSheet[];

  /** The sheet chosen at preview or commit. */
  @Column({ type: 'varchar', length: 200, name: 'sheet_name', nullable: true })
  sheetName: string | null;

  /** Default campaign for rows without a campaign column. */
  @Column({ type: 'integer', name: 'campaign_id', nullable: true })
  campaignId: number | null;

  @Column({ type: 'simple-json', nullable: true })
  columns: ColumnMapping | null;

  @Column({ type: 'varchar', length: 16, nullable: true })
  mode: ImportMode | null;

  /** Rows handled so far in the running phase. */
  @Column({ type: 'integer', name: 'rows_processed', default: 0 })
  rowsProcessed: number;

  /** Rows the running phase will handle. */
  @Column({ type: 'integer', name: 'rows_total', default: 0 })
  rowsTotal: number;

  @Column({ type: 'integer', name: 'new_rows', default: 0 })
  newRows: number;

  @Column({ type: 'integer', name: 'updated_rows', default: 0 })
  updatedRows: number;

  @Column({ type: 'integer', name: 'unchanged_rows', default: 0 })
  unchangedRows: number;

  @Column({ type: 'integer', name: 'invalid_rows', default: 0 })
  invalidRows: number;

  /** Every problem of the last preview or commit, by row. */
  @Column({ type: 'simple-json' })
  problems: ImportProblemDto[];

  /** Versions of the stored records the preview compared rows with (`variant:12` → 3); a commit refuses rows whose record has moved on. */
  @Column({ type: 'simple-json', name: 'seen_versions' })
  seenVersions: Record<string, number>;

  /** The first rows as they will be (or were) stored, with the column labels in stored units. */
  @Column({ type: 'simple-json' })
  preview: { columns: string[]; rows: ImportPreviewRowDto[] };

  /** Why the job failed, or a summary of what was written. */
  @Column({ type: 'text', nullable: true })
  message: string | null;

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  @Column({ type: 'datetime', name: 'finished_at', nullable: true })
  finishedAt: Date | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
