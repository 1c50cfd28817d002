import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import type { VariantStatus } from '@shared/schemas/variant';
import { Campaign } from '../campaigns/campaign.entity';
import { Enzyme } from '../enzymes/enzyme.entity';
import { Mutation } from './mutation.entity';

/**
 * A set of point mutations on a campaign's parent enzyme. The empty set is the campaign's parent
 * variant (label `parent`). The `summary_*` columns are derived from the variant's measurements and
 * the condition-matched parent; they are recomputed on every write that can change them so that the
 * registry can filter and sort 100,000 variants on indexed columns.
 */
@Entity('variants')
@Index('idx_variants_campaign_key', ['campaignId', 'mutationKey'], { unique: true })
@Index('idx_variants_campaign_status', ['campaignId', 'status'])
@Index('idx_variants_campaign_label', ['campaignId', 'label'])
@Index('idx_variants_campaign_first_position', ['campaignId', 'firstPosition'])
@Index('idx_variants_campaign_kcat', ['campaignId', 'summaryKcat'])
@Index('idx_variants_campaign_km', ['campaignId', 'summaryKm'])
@Index('idx_variants_campaign_kcat_over_km', ['campaignId', 'summaryKcatOverKm'])
@Index('idx_variants_campaign_ddg', ['campaignId', 'summaryDdgKjPerMol'])
@Index('idx_variants_campaign_fold_change', ['campaignId', 'summaryFoldChange'])
@Index('idx_variants_campaign_updated', ['campaignId', 'updatedAt'])
@Index('idx_variants_ddg', ['summaryDdgKjPerMol'])
// The registry's most common view: one campaign, one status, ranked by ΔΔG‡ or fold change with a
// fold-change floor; these two answer it from the index alone.
@Index('idx_variants_campaign_status_ddg', ['campaignId', 'status', 'summaryDdgKjPerMol', 'summaryFoldChange'])
@Index('idx_variants_campaign_status_fold_change', ['campaignId', 'status', 'summaryFoldChange', 'summaryDdgKjPerMol'])
@Index('idx_variants_updated', ['updatedAt'])
@Index('idx_variants_parent_variant', ['parentVariantId'])
export class Variant {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'campaign_id' })
  campaignId: number;

  @ManyToOne(() => Campaign, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'campaign_id' })
  campaign: Relation<Campaign>;

  /** The parent enzyme the positions refer to (the campaign's enzyme). */
  @Column({ type: 'integer', name: 'enzyme_id' })
  enzymeId: number;

  @ManyToOne(() => Enzyme, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'enzyme_id' })
  enzyme: Relation<Enzyme>;

  /** The variant this one was made from (lineage across rounds); null for first-round variants. */
  @Column({ type: 'integer', name: 'parent_variant_id', nullable: true })
  parentVariantId: number | null;

  @ManyToOne(() => Variant, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'parent_variant_id' })
  parentVariant: Relation<Variant> | null;

  /** Canonical label: positions ascending, `/`-joined one-letter shorthand (`C112A/H190N`), or `parent`. */
  @Column({ type: 'varchar', length: 500 })
  label: string;

  /** The same set in HGVS protein notation (`p.[Cys112Ala;His190Asn]`). */
  @Column({ type: 'varchar', length: 1000 })
  hgvs: string;

  /** Uniqueness key of the mutation set within a campaign. */
  @Column({ type: 'varchar', length: 500, name: 'mutation_key' })
  mutationKey: string;

  @Column({ type: 'integer', name: 'mutation_count' })
  mutationCount: number;

  /** Lowest mutated position (null for the parent), for sorting by position. */
  @Column({ type: 'integer', name: 'first_position', nullable: true })
  firstPosition: number | null;

  @OneToMany(() => Mutation, (mutation) => mutation.variant)
  mutations: Relation<Mutation[]>;

  @Column({ type: 'varchar', length: 100, name: 'construct_id', nullable: true })
  constructId: string | null;

  @Column({ type: 'varchar', length: 24 })
  status: VariantStatus;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  /** kcat of the summary comparison's variant measurements (inverse-variance combined), s⁻¹. */
  @Column({ type: 'real', name: 'summary_kcat', nullable: true })
  summaryKcat: number | null;

  /** Km, M. */
  @Column({ type: 'real', name: 'summary_km', nullable: true })
  summaryKm: number | null;

  /** kcat/Km, M⁻¹ s⁻¹. */
  @Column({ type: 'real', name: 'summary_kcat_over_km', nullable: true })
  summaryKcatOverKm: number | null;

  /** kcat/Km of the variant over that of the condition-matched parent (dimensionless). */
  @Column({ type: 'real', name: 'summary_fold_change', nullable: true })
  summaryFoldChange: number | null;

  /** ΔΔG‡ for kcat/Km against the matched parent, kJ/mol (positive = slower than the parent). */
  @Column({ type: 'real', name: 'summary_ddg_kj_per_mol', nullable: true })
  summaryDdgKjPerMol: number | null;

  /** Standard error of summaryDdgKjPerMol, kJ/mol. */
  @Column({ type: 'real', name: 'summary_ddg_se_kj_per_mol', nullable: true })
  summaryDdgSeKjPerMol: number | null;

  /** pH optimum of the latest bell-shaped pH profile. */
  @Column({ type: 'real', name: 'summary_ph_optimum', nullable: true })
  summaryPhOptimum: number | null;

  /** Number of measurements that count (not retracted, flagged or superseded). */
  @Column({ type: 'integer', name: 'summary_measurement_count', default: 0 })
  summaryMeasurementCount: number;

  /** Best STRENDA completeness among those measurements, 0–1. */
  @Column({ type: 'real', name: 'summary_completeness', nullable: true })
  summaryCompleteness: number | null;

  /** Plausibility and review flag codes of those measurements, comma-separated. */
  @Column({ type: 'varchar', length: 500, name: 'summary_flags', default: '' })
  summaryFlags: string;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
