import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { Assay } from './assay.entity';

/** One initial-rate observation of an assay. */
@Entity('rate_points')
@Index('idx_rate_points_assay', ['assayId'])
export class RatePoint {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'assay_id' })
  assayId: number;

  @ManyToOne(() => Assay, (assay) => assay.points, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'assay_id' })
  assay: Relation<Assay>;

  /** Substrate concentration, M. */
  @Column({ type: 'real', name: 'substrate_molar' })
  substrateMolar: number;

  /** Initial rate v0, M s⁻¹. */
  @Column({ type: 'real', name: 'rate_molar_per_second' })
  rateMolarPerSecond: number;

  /** Replicate series, 1-based. */
  @Column({ type: 'integer', default: 1 })
  replicate: number;

  /** Excluded points stay stored but do not enter the fit. */
  @Column({ type: 'boolean', default: false })
  excluded: boolean;

  @Column({ type: 'varchar', length: 300, name: 'exclusion_reason', nullable: true })
  exclusionReason: string | null;
}
