import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { MailKind, OutboxStatus } from '@shared/schemas/mail';

/**
 * One message to one recipient, written in the same transaction as whatever it announces (an invitation,
 * a reset token, a digest run) and then handed to SMTP by the delivery worker, with its attempts and the
 * last error: the send log. Rows are written by the system only, never edited by a person.
 */
@Entity('outbox_messages')
@Index('idx_outbox_messages_status_next_attempt', ['status', 'nextAttemptAt'])
@Index('idx_outbox_messages_digest_run', ['digestRunId'])
@Index('idx_outbox_messages_created', ['createdAt'])
export class OutboxMessage {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Column({ type: 'varchar', length: 24 })
  kind: MailKind;

  @Column({ type: 'varchar', length: 254, name: 'to_address' })
  toAddress: string;

  @Column({ type: 'varchar', length: 120, name: 'to_name', nullable: true })
  toName: string | null;

  @Column({ type: 'varchar', length: 320, name: 'from_address' })
  fromAddress: string;

  @Column({ type: 'varchar', length: 500 })
  subject: string;

  /** The plain-text part. */
  @Column({ type: 'text' })
  text: string;

  /** The HTML part. */
  @Column({ type: 'text' })
  html: string;

  /** Extra header fields (List-Unsubscribe, …). */
  @Column({ type: 'simple-json' })
  headers: Record<string, string>;

  @Column({ type: 'varchar', length: 12, default: 'queued' })
  status: OutboxStatus;

  /** Delivery attempts made so far. */
  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ type: 'varchar', length: 1000, name: 'last_error', nullable: true })
  lastError: string | null;

  /** When the next attempt is due; null once the message is sent or has failed for good. */
  @Column({ type: 'datetime', name: 'next_attempt_at', nullable: true })
  nextAttemptAt: Date | null;

  /** The Message-ID header, fixed at enqueue so every attempt sends the same message. */
  @Index('idx_outbox_messages_message_id', { unique: true })
  @Column({ type: 'varchar', length: 255, name: 'message_id' })
  messageId: string;

  @Column({ type: 'datetime', name: 'sent_at', nullable: true })
  sentAt: Date | null;

  /** What the SMTP server answered to the accepted message. */
  @Column({ type: 'varchar', length: 500, name: 'smtp_response', nullable: true })
  smtpResponse: string | null;

  /** The digest run this message belongs to, if any. */
  @Column({ type: 'integer', name: 'digest_run_id', nullable: true })
  digestRunId: number | null;

  @CreateDateColumn({ type: 'datetime', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', name: 'updated_at' })
  updatedAt: Date;
}
