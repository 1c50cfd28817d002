import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type AttachmentOwner = 'assay' | 'import';

/** A stored file (instrument export, imported sheet). The bytes live on disk under the data folder. */
@Entity('attachments')
@Index('idx_attachments_owner', ['ownerType', 'ownerId'])
@Index('idx_attachments_sha256', ['sha256'])
export class Attachment {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'varchar', length: 16, name: 'owner_type' })
  ownerType: AttachmentOwner;

  @Column({ type: 'integer', name: 'owner_id' })
  ownerId: number;

  @Column({ type: 'varchar', length: 255, name: 'original_name' })
  originalName: string;

  @Column({ type: 'varchar', length: 127, name: 'media_type' })
  mediaType: string;

  /** Size, bytes. */
  @Column({ type: 'integer', name: 'size_bytes' })
  sizeBytes: number;

  /** SHA-256 of the content, hex. */
  @Column({ type: 'varchar', length: 64 })
  sha256: string;

  /** Path relative to the data folder. */
  @Column({ type: 'varchar', length: 500, name: 'stored_path' })
  storedPath: string;

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;
}
