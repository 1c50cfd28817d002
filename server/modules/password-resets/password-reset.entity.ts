import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { User } from '../users/user.entity';

/**
 * A password-reset link sent to a user. Only the SHA-256 hash of its token is stored; it works once,
 * until `expiresAt`. Written by the system only (no one edits it), so it carries no version.
 */
@Entity('password_resets')
@Index('idx_password_resets_user', ['userId'])
export class PasswordReset {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'integer', name: 'user_id' })
  userId: number;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user: Relation<User>;

  /** SHA-256 (hex) of the link token. */
  @Index('idx_password_resets_token_hash', { unique: true })
  @Column({ type: 'varchar', length: 64, name: 'token_hash' })
  tokenHash: string;

  @Column({ type: 'datetime', name: 'expires_at' })
  expiresAt: Date;

  /** When the link was used, or made void by a later reset of the same account. */
  @Column({ type: 'datetime', name: 'used_at', nullable: true })
  usedAt: Date | null;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;
}
