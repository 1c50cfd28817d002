import { CreateDateColumn, Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A header line of a received message. */
export interface ReceivedHeader {
  name: string;
  value: string;
}

/**
 * A message as the local fake SMTP server received it over SMTP and mailparser read it: what the
 * Outbox page shows when no real SMTP server is configured. Nothing is relayed anywhere.
 */
@Entity('received_messages')
@Index('idx_received_messages_received', ['receivedAt'])
export class ReceivedMessage {
  @PrimaryGeneratedColumn({ type: 'integer' })
  id: number;

  @Index('idx_received_messages_message_id')
  @Column({ type: 'varchar', length: 255, name: 'message_id', nullable: true })
  messageId: string | null;

  /** MAIL FROM of the SMTP envelope. */
  @Column({ type: 'varchar', length: 320, name: 'envelope_from' })
  envelopeFrom: string;

  /** RCPT TO addresses of the SMTP envelope. */
  @Column({ type: 'simple-json', name: 'envelope_to' })
  envelopeTo: string[];

  @Column({ type: 'varchar', length: 500, name: 'from_header' })
  fromHeader: string;

  @Column({ type: 'varchar', length: 1000, name: 'to_header' })
  toHeader: string;

  @Column({ type: 'varchar', length: 500 })
  subject: string;

  @Column({ type: 'text' })
  text: string;

  @Column({ type: 'text', nullable: true })
  html: string | null;

  /** Every header line as received (unfolded). */
  @Column({ type: 'simple-json' })
  headers: ReceivedHeader[];

  /** Size of the message source, bytes. */
  @Column({ type: 'integer', name: 'size_bytes' })
  sizeBytes: number;

  @CreateDateColumn({ type: 'datetime', name: 'received_at' })
  receivedAt: Date;
}
