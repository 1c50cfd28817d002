import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { CatalyticRole } from '@shared/schemas/enzyme';
import { Enzyme } from './enzyme.entity';

/** A residue annotation on a parent enzyme (its role in catalysis or binding). */
@Entity('catalytic_sites')
@Index('idx_catalytic_sites_enzyme_position_role', ['enzymeId', 'position', 'role'], { unique: true })
@Index('idx_catalytic_sites_role', ['role', 'enzymeId', 'position'])
export class CatalyticSite {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'enzyme_id' })
  enzymeId: number;

  @ManyToOne(() => Enzyme, (enzyme) => enzyme.sites, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'enzyme_id' })
  enzyme: Relation<Enzyme>;

  /** 1-based residue number in the enzyme's sequence. */
  @Column({ type: 'integer' })
  position: number;

  /** One-letter residue; must equal the sequence at `position`. */
  @Column({ type: 'varchar', length: 1 })
  residue: string;

  @Column({ type: 'varchar', length: 32 })
  role: CatalyticRole;

  /** Expected (or literature) pKa of the side chain in this enzyme, if known. */
  @Column({ type: 'real', name: 'expected_pka', nullable: true })
  expectedPka: number | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  note: string | null;
}
