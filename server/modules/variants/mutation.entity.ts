import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { Variant } from './variant.entity';

/** One substitution of a variant: `from` at `position` of the parent sequence becomes `to`. */
@Entity('mutations')
@Index('idx_mutations_variant_position', ['variantId', 'position'], { unique: true })
@Index('idx_mutations_position', ['position', 'variantId'])
@Index('idx_mutations_to_residue', ['toResidue', 'variantId'])
@Index('idx_mutations_from_residue', ['fromResidue', 'variantId'])
export class Mutation {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'variant_id' })
  variantId: number;

  @ManyToOne(() => Variant, (variant) => variant.mutations, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'variant_id' })
  variant: Relation<Variant>;

  /** 1-based position in the parent sequence. */
  @Column({ type: 'integer' })
  position: number;

  /** Parent residue, one-letter. */
  @Column({ type: 'varchar', length: 1, name: 'from_residue' })
  fromResidue: string;

  /** New residue, one-letter (`*` for a stop). */
  @Column({ type: 'varchar', length: 1, name: 'to_residue' })
  toResidue: string;
}
