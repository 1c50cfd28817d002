import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import { Variant } from '../variants/variant.entity';
import { RatePoint } from './rate-point.entity';

export type AssayMethod = 'continuous' | 'discontinuous';

/** One kinetic experiment on one variant under one set of conditions. Quantities in SI-coherent units. */
@Entity('assays')
@Index('idx_assays_variant_conditions', ['variantId', 'substrate', 'temperatureK', 'ph'])
@Index('idx_assays_date', ['assayDate'])
export class Assay {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'variant_id' })
  variantId: number;

  @ManyToOne(() => Variant, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'variant_id' })
  variant: Relation<Variant>;

  @Column({ type: 'varchar', length: 200 })
  substrate: string;

  /** Assay temperature, K. */
  @Column({ type: 'real', name: 'temperature_k' })
  temperatureK: number;

  @Column({ type: 'real' })
  ph: number;

  @Column({ type: 'varchar', length: 100, name: 'buffer_name', nullable: true })
  bufferName: string | null;

  /** Buffer concentration, M. */
  @Column({ type: 'real', name: 'buffer_molar', nullable: true })
  bufferMolar: number | null;

  /** Ionic strength, M. */
  @Column({ type: 'real', name: 'ionic_strength_molar', nullable: true })
  ionicStrengthMolar: number | null;

  /** Metal salt added, e.g. `ZnCl2`. */
  @Column({ type: 'varchar', length: 50, name: 'metal_salt', nullable: true })
  metalSalt: string | null;

  /** Metal salt concentration, M. */
  @Column({ type: 'real', name: 'metal_molar', nullable: true })
  metalMolar: number | null;

  /** Other components of the assay mixture, free text. */
  @Column({ type: 'varchar', length: 500, name: 'other_components', nullable: true })
  otherComponents: string | null;

  /** Total enzyme concentration [E]t, M. */
  @Column({ type: 'real', name: 'enzyme_molar', nullable: true })
  enzymeMolar: number | null;

  /** The unit the enzyme concentration was entered in, kept for display. */
  @Column({ type: 'varchar', length: 8, name: 'enzyme_unit', nullable: true })
  enzymeUnit: string | null;

  @Column({ type: 'varchar', length: 16, nullable: true })
  method: AssayMethod | null;

  /** Detection, e.g. "absorbance 405 nm". */
  @Column({ type: 'varchar', length: 200, nullable: true })
  detection: string | null;

  /** Day of the experiment, ISO `YYYY-MM-DD`. */
  @Column({ type: 'varchar', length: 10, name: 'assay_date' })
  assayDate: string;

  @Column({ type: 'integer', name: 'operator_id', nullable: true })
  operatorId: number | null;

  /** Units the rate points were entered in, kept so the entry can be shown as typed. */
  @Column({ type: 'varchar', length: 8, name: 's_unit', nullable: true })
  sUnit: string | null;

  @Column({ type: 'varchar', length: 16, name: 'v_unit', nullable: true })
  vUnit: string | null;

  @Column({ type: 'integer', name: 'replicate_count', default: 1 })
  replicateCount: number;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @OneToMany(() => RatePoint, (point) => point.assay)
  points: Relation<RatePoint[]>;

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
