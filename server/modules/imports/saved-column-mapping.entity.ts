import { Column, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import type { RememberedMapping } from '@shared/imports/detect-columns';
import type { ImportKind } from '@shared/schemas/import';

/**
 * The column mapping a user last previewed for one import kind, by header text, offered again for the
 * next file of that kind whose headers match.
 */
@Entity('saved_column_mappings')
@Index('idx_saved_column_mappings_user_kind', ['userId', 'kind'], { unique: true })
export class SavedColumnMapping {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'user_id' })
  userId: number;

  @Column({ type: 'varchar', length: 16 })
  kind: ImportKind;

  /** Field key → header text and chosen unit. */
  @Column({ type: 'simple-json' })
  mapping: RememberedMapping;

  @VersionColumn({ type: 'integer' })
  version: number;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
