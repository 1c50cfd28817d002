import { Column, CreateDateColumn, Entity, JoinColumn, OneToOne, PrimaryColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import type { DigestReviewState } from '@shared/schemas/digest';
import { Campaign } from '../campaigns/campaign.entity';

/** A campaign's digest settings, chosen by its lead; a campaign without a row uses the defaults. */
@Entity('digest_settings')
export class DigestSetting {
  @PrimaryColumn({ type: 'integer', name: 'campaign_id' })
  campaignId: number;

  @OneToOne(() => Campaign, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'campaign_id' })
  campaign: Relation<Campaign>;

  /** The review states whose measurements count in the ranking. */
  @Column({ type: 'simple-json', name: 'review_states' })
  reviewStates: DigestReviewState[];

  /** How many variants the ranking lists. */
  @Column({ type: 'integer', name: 'top_count' })
  topCount: number;

  @Column({ type: 'integer', name: 'updated_by_id', nullable: true })
  updatedById: number | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
