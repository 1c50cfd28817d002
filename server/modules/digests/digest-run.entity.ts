import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { DigestContentDto, DigestRunKind, DigestRunStatus } from '@shared/schemas/digest';
import { Campaign } from '../campaigns/campaign.entity';
import { User } from '../users/user.entity';

/**
 * One digest of one campaign: claimed (`preparing`), then generated and its messages queued (`queued`) in
 * one transaction. The unique key on campaign and week lets a scheduled run happen once per week however
 * often the server restarts; manual runs ("send now") have no week.
 */
@Entity('digest_runs')
@Index('idx_digest_runs_campaign_week', ['campaignId', 'weekKey'], { unique: true })
@Index('idx_digest_runs_campaign_created', ['campaignId', 'createdAt'])
@Index('idx_digest_runs_status', ['status'])
export class DigestRun {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'campaign_id' })
  campaignId: number;

  @ManyToOne(() => Campaign, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'campaign_id' })
  campaign: Relation<Campaign>;

  @Column({ type: 'varchar', length: 12 })
  kind: DigestRunKind;

  /** Local date (`YYYY-MM-DD`, installation time zone) of the scheduled slot; null for manual runs. */
  @Column({ type: 'varchar', length: 10, name: 'week_key', nullable: true })
  weekKey: string | null;

  @Column({ type: 'varchar', length: 12 })
  status: DigestRunStatus;

  /** The scheduled slot, or when "send now" was pressed; the end of the digest's week. */
  @Column({ type: 'datetime', name: 'scheduled_for' })
  scheduledFor: Date;

  @Column({ type: 'integer', name: 'triggered_by_id', nullable: true })
  triggeredById: number | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'triggered_by_id' })
  triggeredBy: Relation<User> | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  subject: string | null;

  /** The content as generated, so the run can be read again and the next run can find the movers. */
  @Column({ type: 'simple-json', nullable: true })
  snapshot: DigestContentDto | null;

  @Column({ type: 'integer', name: 'recipient_count', default: 0 })
  recipientCount: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @Column({ type: 'datetime', name: 'completed_at', nullable: true })
  completedAt: Date | null;
}
