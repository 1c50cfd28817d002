import { Column, CreateDateColumn, Entity, Index, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import type { Cofactor } from '@shared/schemas/enzyme';
import { CatalyticSite } from './catalytic-site.entity';

/** A parent (template) enzyme: the sequence every variant's mutations refer to. */
@Entity('enzymes')
export class Enzyme {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Index('idx_enzymes_name', { unique: true })
  @Column({ type: 'varchar', length: 200 })
  name: string;

  /** IUBMB EC number, e.g. `3.5.1.4`; partial and preliminary forms allowed. */
  @Column({ type: 'varchar', length: 32, name: 'ec_number', nullable: true })
  ecNumber: string | null;

  /** UniProt-style accession, checked by pattern only. */
  @Column({ type: 'varchar', length: 16, nullable: true })
  accession: string | null;

  /** Source organism as free text ("synthetic construct" for designed enzymes). */
  @Column({ type: 'varchar', length: 200 })
  organism: string;

  /** One-letter amino-acid sequence, upper case; position 1 is the first letter. */
  @Column({ type: 'text' })
  sequence: string;

  @Column({ type: 'simple-json' })
  cofactors: Cofactor[];

  @Column({ type: 'varchar', length: 200, name: 'other_cofactors', nullable: true })
  otherCofactors: string | null;

  @OneToMany(() => CatalyticSite, (site) => site.enzyme)
  sites: Relation<CatalyticSite[]>;

  @Column({ type: 'integer', name: 'created_by_id', nullable: true })
  createdById: number | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
