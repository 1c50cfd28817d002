import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import type { CampaignStatus } from '@shared/schemas/campaign';
import { Enzyme } from '../enzymes/enzyme.entity';
import { User } from '../users/user.entity';

/** An engineering campaign on one parent enzyme, with the conditions its variants are judged under. */
@Entity('campaigns')
export class Campaign {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Index('idx_campaigns_name', { unique: true })
  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'text' })
  objective: string;

  @Index('idx_campaigns_enzyme_id')
  @Column({ type: 'integer', name: 'enzyme_id' })
  enzymeId: number;

  @ManyToOne(() => Enzyme, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'enzyme_id' })
  enzyme: Relation<Enzyme>;

  @Column({ type: 'varchar', length: 200, name: 'target_substrate' })
  targetSubstrate: string;

  /** Target assay pH. */
  @Column({ type: 'real', name: 'target_ph' })
  targetPh: number;

  /** Target assay temperature, K. */
  @Column({ type: 'real', name: 'target_temperature_k' })
  targetTemperatureK: number;

  @Column({ type: 'integer', name: 'lead_id', nullable: true })
  leadId: number | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'lead_id' })
  lead: Relation<User> | null;

  @Column({ type: 'varchar', length: 16, default: 'active' })
  status: CampaignStatus;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
