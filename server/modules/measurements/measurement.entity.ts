import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import { Assay } from '../assays/assay.entity';
import { Variant } from '../variants/variant.entity';

export const reviewStates = ['draft', 'submitted', 'approved', 'flagged', 'retracted'] as const;
export type ReviewState = (typeof reviewStates)[number];
export type MeasurementSource = 'fitted' | 'entered';
export type KineticModel = 'michaelis-menten' | 'substrate-inhibition' | 'hill';

/** A stored flag: a plausibility or reporting concern with its message. */
export interface StoredFlag {
  code: string;
  severity: 'implausible' | 'warning';
  message: string;
}

/**
 * The fitted (or directly entered) kinetic parameters of one assay, in SI-coherent units. Never
 * deleted: a retracted measurement keeps its row and reason; a refit supersedes the older row.
 */
@Entity('measurements')
@Index('idx_measurements_variant_state', ['variantId', 'reviewState'])
@Index('idx_measurements_assay', ['assayId'])
@Index('idx_measurements_state_created', ['reviewState', 'createdAt'])
export class Measurement {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'assay_id' })
  assayId: number;

  @ManyToOne(() => Assay, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'assay_id' })
  assay: Relation<Assay>;

  @Column({ type: 'integer', name: 'variant_id' })
  variantId: number;

  @ManyToOne(() => Variant, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'variant_id' })
  variant: Relation<Variant>;

  /** `fitted` from the assay's rate points on the server, or `entered` as reported values. */
  @Column({ type: 'varchar', length: 8 })
  source: MeasurementSource;

  @Column({ type: 'varchar', length: 24 })
  model: KineticModel;

  /** Maximum rate, M s⁻¹ (fitted measurements only). */
  @Column({ type: 'real', nullable: true })
  vmax: number | null;

  @Column({ type: 'real', name: 'vmax_se', nullable: true })
  vmaxSe: number | null;

  /** Turnover number, s⁻¹. */
  @Column({ type: 'real', nullable: true })
  kcat: number | null;

  @Column({ type: 'real', name: 'kcat_se', nullable: true })
  kcatSe: number | null;

  /** Michaelis constant (or K½ for the Hill model), M. */
  @Column({ type: 'real', nullable: true })
  km: number | null;

  @Column({ type: 'real', name: 'km_se', nullable: true })
  kmSe: number | null;

  /** Specificity constant, M⁻¹ s⁻¹. */
  @Column({ type: 'real', name: 'kcat_over_km', nullable: true })
  kcatOverKm: number | null;

  @Column({ type: 'real', name: 'kcat_over_km_se', nullable: true })
  kcatOverKmSe: number | null;

  /** Substrate inhibition constant, M. */
  @Column({ type: 'real', nullable: true })
  ki: number | null;

  @Column({ type: 'real', name: 'ki_se', nullable: true })
  kiSe: number | null;

  /** Hill coefficient (dimensionless). */
  @Column({ type: 'real', name: 'hill_n', nullable: true })
  hillN: number | null;

  @Column({ type: 'real', name: 'hill_n_se', nullable: true })
  hillNSe: number | null;

  /** 95 % confidence intervals by parameter name, in the stored units. */
  @Column({ type: 'simple-json', name: 'ci95' })
  ci95: Record<string, [number, number]>;

  /** Residual standard deviation of the fit, M s⁻¹. */
  @Column({ type: 'real', name: 'residual_sd', nullable: true })
  residualSd: number | null;

  @Column({ type: 'integer', name: 'degrees_of_freedom', nullable: true })
  degreesOfFreedom: number | null;

  /** Points used in the fit. */
  @Column({ type: 'integer', name: 'point_count', nullable: true })
  pointCount: number | null;

  /** Lowest and highest substrate concentration tested, M. */
  @Column({ type: 'real', name: 'substrate_min_molar', nullable: true })
  substrateMinMolar: number | null;

  @Column({ type: 'real', name: 'substrate_max_molar', nullable: true })
  substrateMaxMolar: number | null;

  /** How the numbers were obtained, e.g. "Levenberg–Marquardt, unweighted" or the reported method. */
  @Column({ type: 'varchar', length: 300, name: 'fitting_method', nullable: true })
  fittingMethod: string | null;

  @Column({ type: 'simple-json' })
  warnings: string[];

  @Column({ type: 'simple-json' })
  flags: StoredFlag[];

  /** Share of the STRENDA required items that are present, 0–1. */
  @Column({ type: 'real', name: 'completeness_score' })
  completenessScore: number;

  /** The STRENDA items that are missing. */
  @Column({ type: 'simple-json', name: 'completeness_missing' })
  completenessMissing: string[];

  @Column({ type: 'varchar', length: 12, name: 'review_state', default: 'draft' })
  reviewState: ReviewState;

  /** Why it was flagged or retracted. */
  @Column({ type: 'varchar', length: 1000, name: 'review_reason', nullable: true })
  reviewReason: string | null;

  @Column({ type: 'integer', name: 'reviewed_by_id', nullable: true })
  reviewedById: number | null;

  @Column({ type: 'datetime', name: 'reviewed_at', nullable: true })
  reviewedAt: Date | null;

  /** The newer measurement that replaces this one (a refit), if any. */
  @Column({ type: 'integer', name: 'superseded_by_id', nullable: true })
  supersededById: number | null;

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
