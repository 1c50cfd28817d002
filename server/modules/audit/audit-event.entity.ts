import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Who changed what and when; written in the same transaction as the change itself. */
@Entity('audit_events')
@Index('idx_audit_events_entity', ['entityType', 'entityId', 'at'])
@Index('idx_audit_events_campaign', ['campaignId', 'at'])
@Index('idx_audit_events_at', ['at'])
export class AuditEvent {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @CreateDateColumn({ type: 'datetime' })
  at: Date;

  @Column({ type: 'integer', name: 'actor_id', nullable: true })
  actorId: number | null;

  /** e.g. `variant`, `measurement`, `enzyme`. */
  @Column({ type: 'varchar', length: 32, name: 'entity_type' })
  entityType: string;

  @Column({ type: 'integer', name: 'entity_id' })
  entityId: number;

  /** The campaign the change belongs to, for the campaign's activity feed. */
  @Column({ type: 'integer', name: 'campaign_id', nullable: true })
  campaignId: number | null;

  /** e.g. `create`, `update`, `status`, `submit`, `approve`, `flag`, `retract`. */
  @Column({ type: 'varchar', length: 24 })
  action: string;

  /** The row before the change, JSON; null for a creation. */
  @Column({ type: 'text', nullable: true })
  before: string | null;

  /** The row after the change, JSON. */
  @Column({ type: 'text', nullable: true })
  after: string | null;
}
