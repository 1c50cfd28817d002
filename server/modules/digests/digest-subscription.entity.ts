import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import { Campaign } from '../campaigns/campaign.entity';
import { User } from '../users/user.entity';

/**
 * Whether a user receives a campaign's weekly digest. A campaign's lead is subscribed without a row; a
 * row with `active` false records that someone (the lead included) unsubscribed, so the default does not
 * come back.
 */
@Entity('digest_subscriptions')
@Index('idx_digest_subscriptions_campaign_user', ['campaignId', 'userId'], { unique: true })
@Index('idx_digest_subscriptions_user', ['userId'])
export class DigestSubscription {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'campaign_id' })
  campaignId: number;

  @ManyToOne(() => Campaign, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'campaign_id' })
  campaign: Relation<Campaign>;

  @Column({ type: 'integer', name: 'user_id' })
  userId: number;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: Relation<User>;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  /**
   * Secret of the one-click unsubscribe link. Kept in plain text, unlike sign-in tokens, because every
   * digest must print it again; it can do nothing but unsubscribe this row.
   */
  @Index('idx_digest_subscriptions_unsubscribe_token', { unique: true })
  @Column({ type: 'varchar', length: 64, name: 'unsubscribe_token' })
  unsubscribeToken: string;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
