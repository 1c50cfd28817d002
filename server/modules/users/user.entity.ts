import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import type { Role } from '@shared/auth/permissions';
import type { UserPreferences } from '@shared/schemas/auth';

/** A person who signs in. */
@Entity('users')
export class User {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  /** Stored lower-cased so uniqueness is case-insensitive. */
  @Index('idx_users_email', { unique: true })
  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  /** `scrypt$N$r$p$salt$hash`, see password.ts. */
  @Column({ type: 'varchar', length: 255, name: 'password_hash' })
  passwordHash: string;

  @Column({ type: 'varchar', length: 20 })
  role: Role;

  /** A deactivated user can no longer sign in and their sessions stop working. */
  @Column({ type: 'boolean', default: true })
  active: boolean;

  /** Display preferences the client remembers for this user (e.g. the ΔΔG‡ energy unit). */
  @Column({ type: 'simple-json', default: '{}' })
  preferences: UserPreferences;

  @Column({ type: 'datetime', name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
