import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import { Variant } from '../variants/variant.entity';

export type PhModel = 'bell' | 'acid' | 'base';
export type PhRateKind = 'kcat' | 'kcatOverKm' | 'v0';

/** A rate against pH for one variant, with the fitted ionisation constants. */
@Entity('ph_profiles')
@Index('idx_ph_profiles_variant', ['variantId', 'createdAt'])
export class PhProfile {
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

  /** Which rate was measured: kcat (s⁻¹), kcat/Km (M⁻¹ s⁻¹) or v0 (M s⁻¹). */
  @Column({ type: 'varchar', length: 12, name: 'rate_kind' })
  rateKind: PhRateKind;

  @Column({ type: 'varchar', length: 8 })
  model: PhModel;

  /** The (pH, rate) points in the rate kind's SI unit, with exclusion marks. */
  @Column({ type: 'simple-json' })
  points: { ph: number; k: number; excluded?: boolean }[];

  @Column({ type: 'real', nullable: true })
  pka1: number | null;

  @Column({ type: 'real', name: 'pka1_se', nullable: true })
  pka1Se: number | null;

  /** Second (basic-limb) pKa of the bell model. */
  @Column({ type: 'real', nullable: true })
  pka2: number | null;

  @Column({ type: 'real', name: 'pka2_se', nullable: true })
  pka2Se: number | null;

  /** Plateau (pH-independent) rate, in the rate kind's unit. */
  @Column({ type: 'real', name: 'k_max' })
  kMax: number;

  @Column({ type: 'real', name: 'k_max_se' })
  kMaxSe: number;

  /** (pKa1 + pKa2)/2 for the bell model. */
  @Column({ type: 'real', name: 'ph_optimum', nullable: true })
  phOptimum: number | null;

  @Column({ type: 'real', name: 'ph_optimum_se', nullable: true })
  phOptimumSe: number | null;

  @Column({ type: 'real', name: 'residual_sd' })
  residualSd: number;

  @Column({ type: 'integer', name: 'degrees_of_freedom' })
  degreesOfFreedom: number;

  @Column({ type: 'simple-json' })
  warnings: string[];

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
