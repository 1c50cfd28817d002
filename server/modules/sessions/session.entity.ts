import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/** A stored express-session, so sign-ins survive a restart. */
@Entity('sessions')
export class SessionRecord {
  @PrimaryColumn({ type: 'varchar', length: 128 })
  sid: string;

  /** The serialised session (JSON). */
  @Column({ type: 'text' })
  data: string;

  /** Unix time in milliseconds after which the session is void. */
  @Index('idx_sessions_expires_at')
  @Column({ type: 'integer', name: 'expires_at' })
  expiresAt: number;

  /** The signed-in user, if any, so all of a user's sessions can be ended at once. */
  @Index('idx_sessions_user_id')
  @Column({ type: 'integer', name: 'user_id', nullable: true })
  userId: number | null;
}
