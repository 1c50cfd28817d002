import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn, type Relation } from 'typeorm';
import type { Role } from '@shared/auth/permissions';
import { User } from '../users/user.entity';

/**
 * An admin's invitation of an e-mail address with a role. The link's token is stored only as its
 * SHA-256 hash; the link works once, until `expiresAt`, unless it is revoked.
 */
@Entity('invitations')
@Index('idx_invitations_email', ['email'])
@Index('idx_invitations_created', ['createdAt'])
export class Invitation {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  /** Lower-cased, like users.email. */
  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 20 })
  role: Role;

  /** SHA-256 (hex) of the link token. */
  @Index('idx_invitations_token_hash', { unique: true })
  @Column({ type: 'varchar', length: 64, name: 'token_hash' })
  tokenHash: string;

  @Column({ type: 'integer', name: 'invited_by_id', nullable: true })
  invitedById: number | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'invited_by_id' })
  invitedBy: Relation<User> | null;

  @Column({ type: 'datetime', name: 'expires_at' })
  expiresAt: Date;

  @Column({ type: 'datetime', name: 'accepted_at', nullable: true })
  acceptedAt: Date | null;

  /** The account created by accepting. */
  @Column({ type: 'integer', name: 'accepted_user_id', nullable: true })
  acceptedUserId: number | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'accepted_user_id' })
  acceptedUser: Relation<User> | null;

  @Column({ type: 'datetime', name: 'revoked_at', nullable: true })
  revokedAt: Date | null;

  @VersionColumn({ type: 'integer' })
  version: number;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
